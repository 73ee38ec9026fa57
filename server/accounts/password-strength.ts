import { readFileSync } from 'node:fs';
import { MIN_PASSWORD_LENGTH } from '../../shared/api/accounts';

const COMMON = new Set(
  readFileSync(new URL('./common-passwords.txt', import.meta.url), 'utf8')
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l && !l.startsWith('#')),
);

/** Runs that keyboards and alphabets make easy to type; a password inside one of them (either way) is a sequence. */
const RUNS = ['abcdefghijklmnopqrstuvwxyz', '0123456789', 'qwertyuiopasdfghjklzxcvbnm', 'qwertzuiopasdfghjklyxcvbnm', 'azertyuiopqsdfghjklmwxcvbn'].flatMap((r) => {
  const long = r.repeat(Math.ceil(64 / r.length) + 1);
  return [long, [...long].reverse().join('')];
});

const LOOK_ALIKE: Record<string, string> = { '0': 'o', '1': 'i', '3': 'e', '4': 'a', '5': 's', '7': 't', '8': 'b', '@': 'a', $: 's', '!': 'i' };

function readings(lower: string): string[] {
  const trimmed = lower.replace(/^[^a-z]+|[^a-z]+$/g, '');
  const deLeet = (s: string) => [...s].map((c) => LOOK_ALIKE[c] ?? c).join('');
  return [lower, lower.replace(/[^a-z0-9]/g, ''), trimmed, deLeet(trimmed), deLeet(lower).replace(/[^a-z]/g, '')];
}

/**
 * What is wrong with a password chosen by a person, in words, or null when it is acceptable:
 * at least MIN_PASSWORD_LENGTH characters, not one short pattern repeated, not a run of the
 * alphabet, digits or a keyboard row, not a common password (common-passwords.txt, also with
 * digits and symbols around it or look-alike characters), and not the person's name or address.
 */
export function passwordProblem(password: string, person?: { email?: string; name?: string }): string | null {
  const length = [...password].length;
  if (length < MIN_PASSWORD_LENGTH) {
    return `the password must have at least ${MIN_PASSWORD_LENGTH} characters (it has ${length}); a short sentence is easy to remember`;
  }
  const lower = password.toLowerCase();
  const unit = /^(.+?)\1+$/su.exec(lower)?.[1];
  if (unit) {
    return unit.length === 1 ? 'the password is one character repeated; choose a few unrelated words' : `the password repeats "${unit}"; choose a few unrelated words`;
  }
  if (new Set(lower).size < 5) return 'the password uses fewer than 5 different characters; choose a few unrelated words';
  if (RUNS.some((r) => r.includes(lower))) return 'the password is a simple sequence (alphabet, digits or a keyboard row); choose a few unrelated words';
  if (readings(lower).some((r) => COMMON.has(r))) {
    return 'the password is one that many people use, and is among the first an attacker tries; choose a few unrelated words';
  }
  const local = person?.email?.split('@')[0]?.toLowerCase() ?? '';
  const names = [local, ...(person?.name?.toLowerCase().split(/\s+/) ?? [])].filter((n) => n.length >= 4);
  if (names.some((n) => lower.includes(n))) return 'the password contains your name or e-mail address; choose something others cannot guess';
  return null;
}
