import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { formatPath } from '../../../shared/schema/errors';
import { zodProblems } from '../../../server/middleware/validate';

// The expected strings are the path form the docs and every problem message use: list positions in brackets,
// field names after dots ("points[3].x").
describe('formatPath', () => {
  it('puts list positions in brackets and field names after dots', () => {
    expect(formatPath(['points', 3, 'x'])).toBe('points[3].x');
    expect(formatPath(['members', 2, 'a'])).toBe('members[2].a');
    expect(formatPath(['tracing', 'side', 'centre', 'h'])).toBe('tracing.side.centre.h');
  });

  it('writes nested lists one bracket each, and a list at the top as brackets only', () => {
    expect(formatPath(['grid', 0, 1])).toBe('grid[0][1]');
    expect(formatPath([4, 'id'])).toBe('[4].id');
  });

  it('names the whole value when the path is empty', () => {
    expect(formatPath([])).toBe('(document)');
    expect(formatPath([], '(body)')).toBe('(body)');
  });
});

describe('the server names request problems with the same path form', () => {
  it('prints a list position in brackets, and the body itself as "(body)"', () => {
    const body = z.object({ ids: z.array(z.number()) });
    const bad = body.safeParse({ ids: [1, 'two'] });
    expect(bad.success).toBe(false);
    expect(zodProblems(bad.error!)).toEqual([expect.stringMatching(/^ids\[1\]: /)]);
    const notObject = body.safeParse('text');
    expect(zodProblems(notObject.error!)).toEqual([expect.stringMatching(/^\(body\): /)]);
  });
});
