import type { Actor } from './index.ts';

export const guildPolicy = {
  'guild.manageSettings': (a: Actor, _record?: undefined) => a.roles.includes('admin'),
};
