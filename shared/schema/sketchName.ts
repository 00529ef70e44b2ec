/**
 * Whether a name the user typed can be a sketch's name: the one check behind every rename (board and
 * library), with the bound the server applies (MAX_NAME_LENGTH, counted after trimming, as the server
 * stores the trimmed name).
 */
import { MAX_NAME_LENGTH } from './sketchVocabulary';

/** Why `candidate` cannot be a sketch name, in words for the user, or null when it can. */
export function sketchNameProblem(candidate: string): string | null {
  const name = candidate.trim();
  if (!name) return 'A sketch needs a name.';
  if (name.length > MAX_NAME_LENGTH) return `At most ${MAX_NAME_LENGTH} characters.`;
  return null;
}
