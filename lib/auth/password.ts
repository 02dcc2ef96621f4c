import { DomainError } from '../domain/errors';
import { randomBytes, scrypt as scryptCb, timingSafeEqual, createHash, type ScryptOptions } from 'node:crypto';

/**
 * At most SCRYPT_CONCURRENCY hashes run at once (default 2 of libuv's 4 threads, so file, DNS and
 * other crypto work always has threads left); up to SCRYPT_QUEUE more wait their turn in order,
 * and past that a request is refused at once with "busy" rather than piling up memory (each hash
 * holds 128 MiB at N=2^17) and delaying every sign-in behind it.
 */
const MAX_RUNNING = Math.max(1, Number(process.env.SCRYPT_CONCURRENCY ?? 2));
const MAX_WAITING = Math.max(0, Number(process.env.SCRYPT_QUEUE ?? 32));
const hashing = { running: 0, peak: 0, started: 0, refused: 0, waiting: [] as (() => void)[] };

/** Counters for tests and logs: how many hashes started, the most at once, how many were refused. */
export function hashingStats() {
  return { started: hashing.started, peak: hashing.peak, refused: hashing.refused, waiting: hashing.waiting.length };
}

export class PasswordHashingBusyError extends DomainError {
  constructor() {
    super('unavailable', 'The server is busy. Wait a minute, then try again.');
  }
}

async function withHashSlot<T>(work: () => Promise<T>): Promise<T> {
  if (hashing.running >= MAX_RUNNING) {
    if (hashing.waiting.length >= MAX_WAITING) {
      hashing.refused++;
      throw new PasswordHashingBusyError();
    }
    await new Promise<void>((resolve) => hashing.waiting.push(resolve));
  } else {
    hashing.running++;
  }
  hashing.started++;
  hashing.peak = Math.max(hashing.peak, hashing.running);
  try {
    return await work();
  } finally {
    const next = hashing.waiting.shift();
    if (next)
      next(); // the slot passes straight to the next in line
    else hashing.running--;
  }
}

function scrypt(password: string, salt: Buffer, keylen: number, opts: ScryptOptions): Promise<Buffer> {
  return withHashSlot(
    () =>
      new Promise((resolve, reject) =>
        scryptCb(password, salt, keylen, opts, (err, key) => (err ? reject(err) : resolve(key))),
      ),
  );
}

// scrypt, memory-hard: OWASP Password Storage Cheat Sheet minimum N=2^17, r=8, p=1.
// Tests may lower the cost with SCRYPT_LOG_N; the parameters travel inside each hash.
const LOG_N = Number(process.env.SCRYPT_LOG_N ?? 17);
const R = 8;
const P = 1;
const KEYLEN = 32;

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const N = 2 ** LOG_N;
  const key = await scrypt(password.normalize('NFC'), salt, KEYLEN, { N, r: R, p: P, maxmem: 256 * N * R });
  return `scrypt$${LOG_N}$${R}$${P}$${salt.toString('base64')}$${key.toString('base64')}`;
}

export async function verifyPassword(password: string, stored: string | null): Promise<boolean> {
  // An unknown account still pays for one hash, so timing does not tell accounts apart.
  const parts = (stored ?? DUMMY).split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return false;
  const [, logN, r, p, saltB64, keyB64] = parts;
  const N = 2 ** Number(logN);
  const expected = Buffer.from(keyB64, 'base64');
  const key = await scrypt(password.normalize('NFC'), Buffer.from(saltB64, 'base64'), expected.length, {
    N,
    r: Number(r),
    p: Number(p),
    maxmem: 256 * N * Number(r),
  });
  return stored !== null && timingSafeEqual(key, expected);
}

const DUMMY = `scrypt$${LOG_N}$8$1$${Buffer.alloc(16).toString('base64')}$${Buffer.alloc(32).toString('base64')}`;

export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: sha256(token) };
}

export function sha256(value: string): string {
  return createHash('sha256').update(value).digest('hex');
}
