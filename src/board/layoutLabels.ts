/** Names of the sketch layouts as the UI shows them. */
const LABELS: Record<string, string> = {
  'four-link-lateral-rod': 'Four-link with lateral rod',
  'triangulated-four-link': 'Triangulated four-link',
  'three-link-lateral-rod': 'Three-link with lateral rod',
  'leaf-spring': 'Leaf spring with shackle',
  'trailing-arm': 'Independent trailing arms',
  'double-wishbone': 'Double wishbone (front)',
};

export function layoutLabel(layout: string): string {
  return LABELS[layout] ?? layout;
}

export const layoutOptions = Object.entries(LABELS).map(([value, label]) => ({ value, label }));
