import type { Response } from 'express';
import type { BuildSheetQuery } from '../../shared/schema/sketchRequests';
import { buildSheetPdf } from '../services/buildSheetPdf';
import type { SheetSource } from '../services/buildSheetPdf/document';

/** Answers a build sheet as a PDF download (the owner's route and the read-only link's share it). */
export async function sendBuildSheet(res: Response, src: SheetSource, query: BuildSheetQuery): Promise<void> {
  const { fileName, pdf } = await buildSheetPdf(src, query);
  res.attachment(fileName);
  res.type('application/pdf').send(pdf);
}
