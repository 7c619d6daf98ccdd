import { hash, verify } from '@node-rs/argon2';

// argon2id (the library default) with the OWASP-recommended minimum (19 MiB, 2 iterations, 1 lane).
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 };

export const hashPassword = (password: string) => hash(password, OPTIONS);

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// A dummy hash verified when the account does not exist, so timing does not reveal which e-mails have accounts.
let dummyHash: Promise<string> | undefined;
export async function burnVerifyTime(password: string) {
  dummyHash ??= hashPassword('not-a-real-password-0000');
  await verifyPassword(await dummyHash, password);
}
