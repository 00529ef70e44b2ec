/**
 * The build sheet as a pdfmake document: the title block, the caution, the datum in words, the side
 * and cross views to scale, the legend of the pivot codes, the pivot and member tables, the geometry
 * for the layout, the targets and the flags. Black on white; the content is the shared sheet model
 * (shared/sheet/buildSheet.ts), the same the browser's printable page lays out.
 */
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import type { Sketch } from '../../../shared/schema/sketch';
import type { LengthUnit } from '../../../shared/units';
import { buildSheet, DATUM_TEXT, type BuildSheet, type SheetPivot } from '../../../shared/sheet/buildSheet';
import { pivotLegend } from '../../../shared/sheet/pivotLegend';
import { sweepOnce } from '../../../shared/sheet/sweepOnce';
import { CAUTION_TEXT, CAUTION_TITLE } from '../../../shared/display/caution';
import { drawView } from './drawing';

export type Paper = 'a4' | 'letter';

/** Page sizes in pt (ISO 216 A4 is 210 × 297 mm; US Letter is 8.5 × 11 in). */
const PAGE: Record<Paper, { size: 'A4' | 'LETTER'; width: number; height: number }> = {
  a4: { size: 'A4', width: 595.28, height: 841.89 },
  letter: { size: 'LETTER', width: 612, height: 792 },
};
const MARGIN = 36;

/** What the title block names beside the sketch itself. */
export interface SheetSource {
  name: string;
  owner: string;
  shop: string | null;
  version: number;
  savedAt: Date;
  document: Sketch;
}

const day = (d: Date) => d.toISOString().slice(0, 10);

function h2(s: string): Content {
  return { text: s, style: 'h2' };
}

const head = (s: string, right = false): TableCell => ({ text: s, bold: true, alignment: right ? 'right' : 'left' });

/**
 * A titled table whose title and column heads repeat on each page it runs over and never stand alone at the
 * foot of a page; `right` lists the columns of numbers (right-aligned).
 */
function table(
  title: string,
  widths: (string | number)[],
  header: string[],
  rows: TableCell[][],
  empty: string,
  right: number[] = [],
): Content {
  if (!rows.length)
    return { stack: [h2(title), { text: empty, italics: true }], unbreakable: true, margin: [0, 0, 0, 6] };
  const titleRow: TableCell[] = header.map((_, i) => (i ? '' : { text: title, style: 'h2', colSpan: header.length }));
  const cells = header.map((s, i) => head(s, right.includes(i)));
  return {
    table: { headerRows: 2, keepWithHeaderRows: 1, dontBreakRows: true, widths, body: [titleRow, cells, ...rows] },
    layout: {
      hLineWidth: (i, node) => (i < 2 || i === node.table.body.length ? 0 : i === 2 ? 1.2 : 0.5),
      vLineWidth: () => 0,
      paddingLeft: (i) => (i ? 4 : 0),
      paddingTop: () => 2,
      paddingBottom: () => 2,
    },
    margin: [0, 0, 0, 8],
  };
}

function pivotRows(pivots: SheetPivot[], withBody: boolean): TableCell[][] {
  return pivots.map((p) => [
    p.id,
    ...(withBody ? [p.body] : []),
    { text: p.x, alignment: 'right' },
    { text: p.y, alignment: 'right' },
    { text: p.z, alignment: 'right' },
  ]);
}

function titleBlock(src: SheetSource, sheet: BuildSheet, u: LengthUnit, paper: Paper): Content {
  const pair = (a: string, b: string): TableCell[] => [{ text: a, bold: true }, b];
  return {
    table: {
      widths: ['auto', '*', 'auto', '*'],
      body: [
        [...pair('Sketch', src.name), ...pair('Layout', sheet.layout)],
        [...pair('Owner', src.owner), ...pair('Shop', src.shop ?? 'none')],
        [...pair('Version', String(src.version)), ...pair('Saved', day(src.savedAt))],
        [
          ...pair('Printed', day(new Date())),
          ...pair('Units', `lengths in ${u}, paper ${paper === 'a4' ? 'A4' : 'Letter'}`),
        ],
      ],
    },
    layout: { hLineWidth: () => 0.6, vLineWidth: () => 0.6, paddingTop: () => 3, paddingBottom: () => 3 },
    margin: [0, 0, 0, 8],
  };
}

function caution(): Content {
  return {
    table: {
      widths: ['*'],
      body: [[{ text: [{ text: `${CAUTION_TITLE}. `, bold: true }, CAUTION_TEXT] }]],
    },
    layout: {
      hLineWidth: () => 1.2,
      vLineWidth: () => 1.2,
      paddingLeft: () => 6,
      paddingTop: () => 5,
      paddingBottom: () => 5,
    },
    margin: [0, 0, 0, 8],
  };
}

/** The flags, the heading kept with the first of them. */
function flagsSection(sheet: BuildSheet): Content {
  const item = (f: BuildSheet['flags'][number]): Content => ({
    text: [{ text: `${f.severity === 'negative' ? 'Stop: ' : ''}${f.title}. `, bold: true }, f.detail],
  });
  const [first, ...rest] = sheet.flags;
  if (sheet.problem || !first) {
    const none = sheet.problem
      ? 'Not swept: no flags can be raised.'
      : 'No flags: the sweep raised no warning and meets every target.';
    return { stack: [h2('Flags'), { text: none, italics: true }], unbreakable: true };
  }
  return {
    stack: [
      { stack: [h2('Flags'), { ul: [item(first)] }], unbreakable: true },
      ...(rest.length ? [{ ul: rest.map(item) }] : []),
    ],
  };
}

/** The PDF build sheet of a sketch, in `u`, on `paper`. A sketch that cannot be swept still prints its geometry. */
export function buildSheetDocument(src: SheetSource, paper: Paper, u: LengthUnit): TDocumentDefinitions {
  const doc = src.document;
  const swept = sweepOnce(doc);
  const sheet = buildSheet(doc, swept.result, swept.problem, u);
  const page = PAGE[paper];
  const width = page.width - 2 * MARGIN;
  const roles = new Map<string, 'frame' | 'moving' | 'reference'>([
    ...sheet.frame.map((p) => [p.id, 'frame'] as const),
    ...sheet.moving.map((p) => [p.id, 'moving'] as const),
    ...sheet.driveline.map((p) => [p.id, 'reference'] as const),
  ]);
  const viewHeight = (page.height - 2 * MARGIN) * 0.42;
  const side = drawView(doc, 'side', roles, u, width, viewHeight);
  const cross = drawView(doc, 'cross', roles, u, width, viewHeight, sheet.crossView);
  const crossName = sheet.crossView === 'front' ? 'Front view' : 'Rear view';
  const coord = (a: string) => `${a} (${u})`;

  const content: Content[] = [
    { text: `Build sheet: ${src.name}`, style: 'h1' },
    titleBlock(src, sheet, u, paper),
    caution(),
    h2('Datum and axes'),
    { text: DATUM_TEXT, margin: [0, 0, 0, 2] },
    {
      text:
        'Both drawings mark the datum (0) and draw the axes as arrows from it. Filled square: frame bracket. ' +
        'Open circle: moving pivot. Cross: driveline reference point (not a bracket). Solid lines: links, rods ' +
        'and arms; dashed: shocks and springs; dash-dot: hinge axes.',
      margin: [0, 0, 0, 6],
    },
    {
      stack: [
        h2(`Side view, seen from the vehicle\u2019s left, scale 1:${side.scale}`),
        { svg: side.svg, width: side.width, height: side.height },
      ],
      unbreakable: true,
    },
    {
      stack: [
        h2(`${crossName}, ${sheet.crossView === 'front' ? 'drawn as ' : ''}seen from behind, scale 1:${cross.scale}`),
        { svg: cross.svg, width: cross.width, height: cross.height },
      ],
      unbreakable: true,
    },
    table(
      'Pivot codes',
      [55, 75, '*'],
      ['Code', 'On', 'What meets there'],
      pivotLegend(doc).map((l) => [l.id, l.on, l.joins]),
      'No pivots.',
    ),
    table(
      'Frame brackets',
      ['*', 60, 60, 60],
      ['Pivot', coord('x'), coord('y'), coord('z')],
      pivotRows(sheet.frame, false),
      'No frame brackets.',
      [1, 2, 3],
    ),
    table(
      sheet.movingTitle,
      ['*', 90, 60, 60, 60],
      ['Pivot', 'On', coord('x'), coord('y'), coord('z')],
      pivotRows(sheet.moving, true),
      'No moving pivots.',
      [2, 3, 4],
    ),
  ];
  if (sheet.driveline.length)
    content.push(
      table(
        'Driveline reference points (not brackets)',
        ['*', 90, 60, 60, 60],
        ['Point', 'On', coord('x'), coord('y'), coord('z')],
        pivotRows(sheet.driveline, true),
        '',
        [2, 3, 4],
      ),
    );
  content.push(
    table(
      'Members, centre to centre at ride height',
      [45, 55, 80, 55, '*'],
      ['Member', 'Kind', 'Ends', 'Length', 'Notes'],
      sheet.members.map((m) => [m.id, m.kind, m.ends, { text: m.length, alignment: 'right' }, m.note]),
      'No members.',
      [3],
    ),
    table(
      'Vehicle',
      ['*', 120],
      ['Quantity', 'Value'],
      sheet.vehicle.map((l) => [l.label, l.value]),
      '',
    ),
  );
  const geometryTitle = `Geometry of the ${sheet.layout.toLowerCase()}`;
  if (sheet.problem)
    content.push({
      stack: [
        h2(geometryTitle),
        {
          text: [
            { text: 'No sweep. ', bold: true },
            `${sheet.problem}. The pivots, members and drawings above are the sketch as saved; the readings of ` +
              'the sweep (travel, geometry over the travel, targets and flags) are missing until it can be swept.',
          ],
        },
      ],
      unbreakable: true,
      margin: [0, 0, 0, 8],
    });
  else
    content.push(
      table(
        geometryTitle,
        ['*', 170],
        ['Quantity', 'Value'],
        sheet.geometry.map((l) => [l.label, l.reason ? `${l.value} (${l.reason})` : l.value]),
        'No readings for this layout.',
      ),
    );
  content.push(
    table(
      'Targets',
      [120, 90, '*'],
      ['Quantity', 'Wanted', 'Sweep'],
      sheet.targets.map((t) => [t.label, t.band, t.status]),
      'No targets set.',
    ),
    flagsSection(sheet),
  );

  return {
    pageSize: page.size,
    pageMargins: [MARGIN, MARGIN, MARGIN, MARGIN + 6],
    info: { title: `Build sheet: ${src.name}`, author: src.owner, creator: 'Arcwright' },
    defaultStyle: { font: 'Roboto', fontSize: 8.5, color: '#000000', lineHeight: 1.15 },
    styles: {
      h1: { fontSize: 15, bold: true, margin: [0, 0, 0, 6] },
      h2: { fontSize: 10.5, bold: true, margin: [0, 6, 0, 3] },
    },
    footer: (current: number, count: number): Content => ({
      columns: [
        {
          text: `${src.name} \u00b7 version ${src.version} \u00b7 geometry only: see the caution on page 1`,
          fontSize: 7,
        },
        { text: `page ${current} of ${count}`, alignment: 'right', fontSize: 7, width: 70 },
      ],
      margin: [MARGIN, 8, MARGIN, 0],
    }),
    content,
  };
}
