// @vitest-environment happy-dom
/** A new sketch from a starter: the one path the library dialog and the board's new-sketch address share. */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { starters } from '../../../shared/kinematics';
import type { Layout, Sketch } from '../../../shared/schema/sketch';
import { useLibraryStore } from '../../../src/stores/library';
import { detailOf } from '../board/fixture';

const posts: { url: string; body: { name: string; document: Sketch } }[] = [];

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      post: vi.fn(async (url: string, body: { name: string; document: Sketch }) => {
        posts.push({ url, body });
        return detailOf(body.document, { id: 41, version: 1 });
      }),
    },
  };
});

describe('library store: a sketch from a starter', () => {
  beforeEach(() => {
    posts.length = 0;
    setActivePinia(createPinia());
  });

  it('with no name or sizes: the starter at its defaults, named after it', async () => {
    const spec = starters['four-link-lateral-rod']!;
    const created = await useLibraryStore().createFromStarter('four-link-lateral-rod');
    expect(created.id).toBe(41);
    expect(posts).toHaveLength(1);
    expect(posts[0].url).toBe('/api/sketches');
    expect(posts[0].body.name).toBe('New four-link with lateral rod');
    expect(posts[0].body.document).toEqual({ ...spec.build(), name: 'New four-link with lateral rod' });
  });

  it('with a name and sizes (the dialog): the sizes shape the document, the name is used as given', async () => {
    const spec = starters['four-link-lateral-rod']!;
    const upper = spec.params.find((p) => p.key === 'upperSpread')!;
    // A size within the starter's range but away from its default, so the document must differ.
    const spread = upper.default === upper.max ? upper.min : upper.max;
    await useLibraryStore().createFromStarter('four-link-lateral-rod', {
      name: 'Hillclimb buggy, rear',
      params: { upperSpread: spread },
    });
    const doc = posts[0].body.document;
    expect(posts[0].body.name).toBe('Hillclimb buggy, rear');
    expect(doc.name).toBe('Hillclimb buggy, rear');
    expect(doc).toEqual({ ...spec.build({ upperSpread: spread }), name: 'Hillclimb buggy, rear' });
    expect(doc.points).not.toEqual(spec.build().points);
  });

  it('refuses a layout without a starter with a message naming it, and posts nothing', async () => {
    await expect(useLibraryStore().createFromStarter('no-such-layout' as Layout)).rejects.toThrow(
      "There is no starter 'no-such-layout'.",
    );
    expect(posts).toHaveLength(0);
  });
});
