import { hash, verify, type Options } from '@node-rs/argon2';

// OWASP's argon2id baseline: 19 MiB memory, 2 iterations, 1 lane.
// algorithm 2 is Argon2id in @node-rs/argon2's const enum, which isolated modules cannot import by name.
const OPTIONS: Options = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 };

export const hashPassword = (password: string) => hash(password, OPTIONS);

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** A hash of a random password, verified against when the e-mail is unknown so both paths take the same time. */
let decoy: Promise<string> | undefined;
export const decoyHash = () => (decoy ??= hashPassword(`decoy-${Math.random()}`));
