/**
 * Where the build sheet's PDF is downloaded from: the owner's address or a read-only link's, with the
 * paper and the user's unit. The server lays the sheet out (server/services/buildSheetPdf).
 */
import type { BuildSheetQuery } from '../../shared/schema/sketchRequests';

export type SheetOf = { id: number } | { token: string };

export const PAPERS: { value: BuildSheetQuery['paper']; label: string }[] = [
  { value: 'a4', label: 'A4' },
  { value: 'letter', label: 'Letter' },
];

export function buildSheetPdfUrl(which: SheetOf, paper: BuildSheetQuery['paper'], units: BuildSheetQuery['units']) {
  const base = 'token' in which ? `/api/shared/${encodeURIComponent(which.token)}` : `/api/sketches/${which.id}`;
  return `${base}/build-sheet?paper=${paper}&units=${units}`;
}
