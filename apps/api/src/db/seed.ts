import { pathToFileURL } from 'node:url';
import type { Sequelize } from 'sequelize';
import type { Role } from '@scrap-relay/shared';
import { hashPassword } from '../auth/passwords.ts';
import { createSequelize } from './sequelize.ts';
import { DEFAULT_GUILD_SETTINGS, Guild, Member, initModels } from './models/index.ts';
import { seedDemoShelf } from './demo-bundles.ts';

/** The invented demo guild: Ferncombe is a made-up town, and every person here is made up. */
export const DEMO_GUILD = { name: 'Ferncombe Patchwork Guild', town: 'Ferncombe', currency: 'USD', inviteCode: 'FERNCOMBE-2026', timeZone: 'America/Los_Angeles' };
export const DEMO_PASSWORD = 'quilt-relay-demo';

interface DemoAccount {
  role: string;
  name: string;
  email: string;
  password: string;
  roles: Role[];
  newQuilterFlag: boolean;
  joinedMonthsAgo: number;
}

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { role: 'admin', name: 'Ada Whitlock', email: 'ada@ferncombe-quilters.example', roles: ['member', 'admin'], joinedMonthsAgo: 60 },
  { role: 'librarian', name: 'Lena Marsh', email: 'lena@ferncombe-quilters.example', roles: ['member', 'librarian'], joinedMonthsAgo: 48 },
  { role: 'treasurer', name: 'Tomas Reyes', email: 'tomas@ferncombe-quilters.example', roles: ['member', 'treasurer'], joinedMonthsAgo: 36 },
  { role: 'new quilter', name: 'Nell Ashby', email: 'nell@ferncombe-quilters.example', roles: ['member'], joinedMonthsAgo: 2 },
  { role: 'member', name: 'Ruth Okafor', email: 'ruth@ferncombe-quilters.example', roles: ['member'], joinedMonthsAgo: 30 },
  { role: 'member', name: 'Gus Pennyworth', email: 'gus@ferncombe-quilters.example', roles: ['member'], joinedMonthsAgo: 20 },
].map((a) => ({ ...a, password: DEMO_PASSWORD, newQuilterFlag: false, roles: a.roles as Role[] }));

const monthsAgo = (months: number, now: Date) => {
  const d = new Date(now);
  d.setUTCMonth(d.getUTCMonth() - months);
  return d;
};

/** Loads the demo guild; running it again changes nothing that is already there. */
export async function seedDemo(sequelize: Sequelize, now = new Date()): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await Guild.findOrCreate({
      where: { id: 1 },
      defaults: { id: 1, name: DEMO_GUILD.name, town: DEMO_GUILD.town, currency: DEMO_GUILD.currency, defaultUnits: 'imperial', settings: { ...DEFAULT_GUILD_SETTINGS, timeZone: DEMO_GUILD.timeZone }, inviteCode: DEMO_GUILD.inviteCode },
      transaction,
    });
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const account of DEMO_ACCOUNTS) {
      await Member.findOrCreate({
        where: { email: account.email },
        defaults: {
          name: account.name,
          email: account.email,
          passwordHash,
          roles: account.roles,
          newQuilterFlag: account.newQuilterFlag,
          joinedAt: monthsAgo(account.joinedMonthsAgo, now),
          emailVerifiedAt: monthsAgo(account.joinedMonthsAgo, now),
          units: null,
        },
        transaction,
      });
    }
  });
}

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('Set DATABASE_URL to load the demo guild.');
  const sequelize = createSequelize(url, { poolMax: 1 });
  initModels(sequelize);
  try {
    await seedDemo(sequelize);
    // The demo shelf needs somewhere to keep its photos; without UPLOAD_DIR only people and the guild are loaded.
    if (process.env.UPLOAD_DIR) await seedDemoShelf(sequelize, process.env.UPLOAD_DIR, DEMO_GUILD.currency, new Date());
  } finally {
    await sequelize.close();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
