import { hash, verify } from '@node-rs/argon2';

// argon2id (algorithm 2) with the OWASP-recommended minimum cost (19 MiB, 2 passes), from memory.
const OPTIONS = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verifying against a fixed hash when the email is unknown keeps both answers equally slow.
let dummyHash: Promise<string> | undefined;
export function dummyVerify(password: string): Promise<boolean> {
  dummyHash ??= hashPassword('kitlane-timing-equaliser');
  return dummyHash.then((h) => verifyPassword(h, password));
}
