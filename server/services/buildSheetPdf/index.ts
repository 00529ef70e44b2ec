/** The build sheet of a sketch as a PDF file: its name and its bytes. */
import type { BuildSheetQuery } from '../../../shared/schema/sketchRequests';
import { downloadBaseName } from '../../../shared/downloadName';
import { buildSheetDocument, type SheetSource } from './document';
import { renderPdf } from './engine';

export async function buildSheetPdf(
  src: SheetSource,
  query: BuildSheetQuery,
): Promise<{ fileName: string; pdf: Buffer }> {
  const pdf = await renderPdf(buildSheetDocument(src, query.paper, query.units));
  return { fileName: `${downloadBaseName(src.name)}.build-sheet.pdf`, pdf };
}
