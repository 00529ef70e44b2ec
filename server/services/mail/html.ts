/** A piece of mail HTML that is safe to insert as it is: what it holds from outside has been escaped. */
export class Html {
  constructor(readonly value: string) {}
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * HTML from a template whose fixed parts are markup: every value put into it is escaped, except a value that
 * is Html already. Names, titles and addresses typed by users thus never become markup.
 */
export function markup(parts: TemplateStringsArray, ...values: (string | number | Html)[]): Html {
  let out = parts[0]!;
  values.forEach((value, i) => {
    out += (value instanceof Html ? value.value : escapeHtml(String(value))) + parts[i + 1]!;
  });
  return new Html(out);
}

/** Text of several lines (as an instructor types it), escaped, its line breaks kept as <br>. */
export function htmlLines(text: string): Html {
  return new Html(escapeHtml(text).replace(/\r?\n/g, '<br>'));
}
