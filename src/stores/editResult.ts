/** What a store action that edits answers: done, or refused with the reason in words for the user. */
export type EditResult = { ok: true } | { ok: false; error: string };
