/**
 * pdfmake set up once for the server: the Roboto faces shipped in pdfmake's own package (found
 * through the package, so the path holds wherever the app is started from), no file outside that
 * folder and no URL ever fetched (a document definition only ever names these fonts).
 */
import { createRequire } from 'node:module';
import path from 'node:path';
import pdfmake from 'pdfmake';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';

const require = createRequire(import.meta.url);
const FONT_DIR = path.join(path.dirname(require.resolve('pdfmake/package.json')), 'fonts', 'Roboto');

pdfmake.setFonts({
  Roboto: {
    normal: path.join(FONT_DIR, 'Roboto-Regular.ttf'),
    bold: path.join(FONT_DIR, 'Roboto-Medium.ttf'),
    italics: path.join(FONT_DIR, 'Roboto-Italic.ttf'),
    bolditalics: path.join(FONT_DIR, 'Roboto-MediumItalic.ttf'),
  },
});
pdfmake.setLocalAccessPolicy((file) => path.resolve(file).startsWith(FONT_DIR + path.sep));
pdfmake.setUrlAccessPolicy(() => false);

/** The PDF of a document definition. */
export function renderPdf(doc: TDocumentDefinitions): Promise<Buffer> {
  return pdfmake.createPdf(doc).getBuffer();
}
