import type { TranslationKeys, ZxcvbnFactory } from '@zxcvbn-ts/core';
import { badRequest } from '../middleware/http-error';

/**
 * How hard a new password is to guess, judged by zxcvbn-ts against its lists of most-used passwords (taken
 * from published password breaches), common English words and names, keyboard patterns, dates and the
 * person's own details. No password leaves the server: there is no online breach look-up.
 */

/**
 * Lowest zxcvbn score taken (0–4). 3 means about 10^8 guesses or more ("safely unguessable" in the zxcvbn
 * paper's scale), out of reach of online guessing and slow for an offline attack on scrypt hashes.
 */
const MIN_SCORE = 3;

/** zxcvbn's feedback in our own words (the keys are the library's; every sentence ends with a full stop). */
const OUR_WORDS: TranslationKeys = {
  warnings: {
    straightRow: 'A straight row of keys is among the first things guessed.',
    keyPattern: 'A short pattern on the keyboard is among the first things guessed.',
    simpleRepeat: 'A character repeated ("aaa") is quickly guessed.',
    extendedRepeat: 'A repeated group of characters ("abcabc") is quickly guessed.',
    sequences: 'A run such as "abc" or "123" is quickly guessed.',
    recentYears: 'A recent year is quickly guessed.',
    dates: 'A date is quickly guessed.',
    topTen: 'It is one of the ten most used passwords.',
    topHundred: 'It is one of the most used passwords.',
    common: 'It is on the lists of most used passwords.',
    similarToCommon: 'It is close to one of the most used passwords.',
    wordByItself: 'A single word is quickly guessed.',
    namesByThemselves: 'A name on its own is quickly guessed.',
    commonNames: 'Common first names and surnames are quickly guessed.',
    userInputs: 'It contains your name or your e-mail address.',
    pwned: 'It has appeared in a published password breach.',
  },
  suggestions: {
    l33t: "Swapping letters for look-alikes ('@' for 'a') does not help.",
    reverseWords: 'A common word spelt backwards does not help.',
    allUppercase: 'Capitals everywhere do not help; a few in the middle do a little.',
    capitalization: 'A capital first letter does not help; one further in does a little.',
    dates: 'Leave out dates and years that belong to you.',
    recentYears: 'Leave out recent years.',
    associatedYears: 'Leave out years that belong to you.',
    sequences: 'Leave out runs such as "abc" or "123".',
    repeated: 'Leave out repeated words and characters.',
    longerKeyboardPattern: 'Leave out keyboard patterns.',
    anotherWord: 'Add another word or two that people rarely use.',
    useWords: 'Use a few unrelated words together; symbols and digits are not needed.',
    noNeed: 'Several unrelated words make a strong password without symbols, digits or capitals.',
    pwned: 'If you use this password anywhere else, change it there too.',
  },
  timeEstimation: {
    ltSecond: 'less than a second',
    second: '{base} second',
    seconds: '{base} seconds',
    minute: '{base} minute',
    minutes: '{base} minutes',
    hour: '{base} hour',
    hours: '{base} hours',
    day: '{base} day',
    days: '{base} days',
    month: '{base} month',
    months: '{base} months',
    year: '{base} year',
    years: '{base} years',
    centuries: 'centuries',
  },
};

/**
 * The check runs on the one event loop, so its cost is bounded: only the first 64 characters are judged
 * (a longer password is a passphrase, or is refused for what its start repeats), look-alike swaps are tried
 * at most 10 at a time, and no near-miss (edit distance) search runs. Measured on this project's 2-core
 * machine under load: tens to a few hundred ms per check instead of seconds for long look-alike strings.
 */
const COST_BOUNDS = { maxLength: 64, l33tMaxSubstitutions: 10, useLevenshteinDistance: false } as const;

/** The checker, built on first use: its word lists are a few MB, loaded once and only when a password is set. */
let checker: Promise<ZxcvbnFactory> | null = null;

function loadChecker(): Promise<ZxcvbnFactory> {
  checker ??= (async () => {
    const [{ ZxcvbnFactory }, common, en] = await Promise.all([
      import('@zxcvbn-ts/core'),
      import('@zxcvbn-ts/language-common'),
      import('@zxcvbn-ts/language-en'),
    ]);
    return new ZxcvbnFactory({
      dictionary: { ...common.dictionary, ...en.dictionary },
      graphs: common.adjacencyGraphs,
      translations: OUR_WORDS,
      ...COST_BOUNDS,
    });
  })();
  return checker;
}

/** The person's own details a password must not be built on: the address, its parts, the name's words. */
function personalWords(email: string, name?: string): string[] {
  const local = email.split('@')[0] ?? '';
  const words = [email, local, ...local.split(/[._+-]+/)];
  if (name) words.push(name, ...name.split(/\s+/));
  return words.filter((w) => w.length >= 3);
}

const squeeze = (s: string) => s.toLowerCase().replace(/[^\p{L}\p{N}]+/gu, '');

/**
 * Why `password` must not be chosen by the holder of `email` (and `name`), in a sentence or two, or null when
 * it may. The address itself and its part before the @ are refused outright, whatever the score.
 */
export async function passwordWeakness(password: string, email: string, name?: string): Promise<string | null> {
  const local = email.split('@')[0] ?? '';
  const own = squeeze(password);
  if (own === squeeze(email) || own === squeeze(local)) {
    return 'It is your e-mail address (or its part before the @). Choose something nobody could read off your mail.';
  }
  const zxcvbn = await loadChecker();
  const result = zxcvbn.check(password, personalWords(email, name));
  if (result.score >= MIN_SCORE) return null;
  const { warning, suggestions } = result.feedback;
  const why = warning || 'It would be guessed too soon.';
  const howTo = suggestions.length ? suggestions.join(' ') : OUR_WORDS.suggestions.useWords;
  return `${why} ${howTo}`;
}

/** Throws 400 naming what is wrong with `password` for this person, when it is too easy to guess. */
export async function refuseWeakPassword(password: string, email: string, name?: string): Promise<void> {
  const weakness = await passwordWeakness(password, email, name);
  if (weakness) throw badRequest('this password is too easy to guess', [`password: ${weakness}`]);
}
