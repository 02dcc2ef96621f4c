/**
 * The password rules, pure so that forms in the browser and the server check the same thing
 * (hashing stays in lib/auth/password.ts). ASVS 6.2: at least 8 characters, no composition
 * rules, commonly breached passwords refused.
 */

/** Commonly breached passwords refused at sign-up and reset (ASVS 6.2.4); a short shipped list, extend as needed. */
export const COMMON_PASSWORDS: readonly string[] = [
  "00000000", "11111111", "12121212", "123123123", "12341234", "12345678", "123456789", "1234567890",
  "123456789a", "1234567a", "123qweasd", "1q2w3e4r", "1q2w3e4r5t", "1qaz2wsx", "1qaz2wsx3edc", "87654321",
  "88888888", "987654321", "987654321a", "a1234567", "a12345678", "aa123456", "abc12345", "abcd1234",
  "abcdefgh", "admin123", "administrator", "asdf1234", "asdfasdf", "asdfghjk", "baseball1", "beekeeper",
  "beekeeping", "changeme", "changeme1", "charlie1", "combtrace", "combtrace1", "computer", "contraseña",
  "dragon123", "football", "football1", "freedom1", "hello123", "hollowmere", "honey1234", "honeybee",
  "honeybees", "honeyhoney", "iloveyou", "iloveyou1", "internet", "jennifer", "jordan23", "killer12",
  "letmein1", "letmeinnow", "master123", "michael1", "monkey123", "motdepasse", "p@ssw0rd", "p@ssword",
  "passw0rd", "password", "password1", "password12", "password123", "passwort", "princess1", "q1w2e3r4",
  "q1w2e3r4t5", "qazwsxedc", "qwerty12", "qwerty123", "qwerty1234", "qwertyui", "qwertyuiop", "secret123",
  "shadow12", "starwars", "sunshine", "superman", "sweethoney", "trustno1", "welcome1", "welcome123",
  "whatever", "whatever1", "zaq12wsx", "zxcvbnm1",
];

const COMMON = new Set(COMMON_PASSWORDS.map((p) => p.toLowerCase()));

/** ASVS 6.2: at least 8 characters, no composition rules, common passwords refused. */
export function passwordProblem(password: string): string | null {
  if ([...password].length < 8) return 'Use at least 8 characters.';
  if ([...password].length > 128) return 'Use at most 128 characters.';
  if (COMMON.has(password.toLowerCase())) return 'That password is too common. Pick something less guessable.';
  return null;
}
