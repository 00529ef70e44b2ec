import { describe, expect, it } from 'vitest';
import { sketchNameProblem } from '../../../shared/schema/sketchName';
import { MAX_NAME_LENGTH } from '../../../shared/schema/sketchVocabulary';
import { createSketchBody } from '../../../shared/schema/sketchRequests';

describe('sketchNameProblem', () => {
  it('refuses an empty name and one of spaces only', () => {
    expect(sketchNameProblem('')).toBe('A sketch needs a name.');
    expect(sketchNameProblem('   ')).toBe('A sketch needs a name.');
  });

  it('takes a name of exactly the limit and refuses one character more, naming the limit', () => {
    expect(MAX_NAME_LENGTH).toBe(200);
    expect(sketchNameProblem('a'.repeat(200))).toBeNull();
    expect(sketchNameProblem('a'.repeat(201))).toBe('At most 200 characters.');
  });

  it('counts the name as it is stored, without the spaces around it', () => {
    expect(sketchNameProblem(`  ${'b'.repeat(200)}  `)).toBeNull();
    expect(sketchNameProblem(' Dune buggy rear ')).toBeNull();
  });

  // The server's request schema is the other judge of a name: the prompt must never pass a name it refuses,
  // nor refuse one it takes.
  it('agrees with the server request schema on every candidate', () => {
    const candidates = [
      '',
      ' ',
      'Rig',
      ' Rig ',
      'x'.repeat(199),
      'x'.repeat(200),
      'x'.repeat(201),
      ` ${'y'.repeat(200)} `,
    ];
    for (const name of candidates) {
      const serverTakes = createSketchBody.safeParse({ name, document: {} }).success;
      expect(sketchNameProblem(name) === null, JSON.stringify(name)).toBe(serverTakes);
    }
  });
});
