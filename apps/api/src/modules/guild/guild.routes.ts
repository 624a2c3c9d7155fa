import { Router } from 'express';
import { guildSettingsSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { authorize } from '../../policies/index.ts';
import { loadGuild, rotateInviteCode, settingsOf, updateSettings } from './guild.service.ts';

export function guildRoutes(): Router {
  const router = Router();

  router.get('/guild/settings', async (req, res) => {
    authorize(requireMember(req), 'guild.manageSettings');
    res.json({ settings: settingsOf(await loadGuild()) });
  });

  router.put('/guild/settings', async (req, res) => {
    authorize(requireMember(req), 'guild.manageSettings');
    const input = parseInput(guildSettingsSchema, req.body);
    res.json({ settings: await updateSettings(input) });
  });

  router.get('/guild/invite-code', async (req, res) => {
    authorize(requireMember(req), 'guild.manageSettings');
    res.json({ inviteCode: (await loadGuild()).inviteCode });
  });

  router.post('/guild/invite-code/rotate', async (req, res) => {
    authorize(requireMember(req), 'guild.manageSettings');
    res.json({ inviteCode: await rotateInviteCode() });
  });

  return router;
}
