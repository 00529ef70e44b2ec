/**
 * Reading the classes API: each answer is checked against the shared schema it is promised to match, and a
 * request body is checked before it is sent, so a problem is named in words (the field and what is wrong)
 * instead of surfacing as a blank screen or a stack trace.
 */
import type { z } from 'zod';

/** The problems of a zod check, one line each, naming the field when there is one. */
export function issueLines(error: z.ZodError, labels: Record<string, string> = {}): string[] {
  return error.issues.map((i) => {
    const field = i.path.length ? String(i.path[0]) : '';
    const label = labels[field] ?? field;
    return label ? `${label}: ${i.message}` : i.message;
  });
}

/** Why `body` cannot be sent (the first problem, field named), or null when the schema takes it. */
export function bodyProblem(schema: z.ZodType, body: unknown, labels: Record<string, string> = {}): string | null {
  const res = schema.safeParse(body);
  return res.success ? null : issueLines(res.error, labels)[0];
}

/** The answer as the schema reads it; an answer of another shape is refused with a plain message. */
export function readAnswer<S extends z.ZodType>(schema: S, raw: unknown, what: string): z.infer<S> {
  const res = schema.safeParse(raw);
  if (res.success) return res.data;
  throw new Error(
    `The server's answer about ${what} could not be read (${issueLines(res.error)[0]}). Reload the page.`,
  );
}
