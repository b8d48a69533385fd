import { hash, verify } from "@node-rs/argon2";

/**
 * argon2id with OWASP's minimum recommended parameters (Password Storage Cheat Sheet):
 * 19 MiB memory, 2 iterations, 1 degree of parallelism.
 */
/** Algorithm 2 is Argon2id in @node-rs/argon2's enum (0 = Argon2d, 1 = Argon2i). */
export const ARGON2_PARAMS = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export const hashPassword = (password: string) => hash(password, ARGON2_PARAMS);

export async function verifyPassword(storedHash: string, password: string): Promise<boolean> {
  try {
    return await verify(storedHash, password);
  } catch {
    return false;
  }
}

/** A hash of a random password, checked against when the e-mail is unknown so timing does not reveal accounts. */
let dummyHash: Promise<string> | undefined;
export const getDummyHash = () => (dummyHash ??= hashPassword("not-a-real-password-" + Math.random()));
