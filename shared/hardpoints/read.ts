/**
 * Reads a hardpoint table (table.ts writes one) against a sketch: which pivots it moves, from where to
 * where, and each row it cannot use with the reason, by row number as a spreadsheet counts them (the
 * header is row 1). Nothing is changed here; the board applies the result only when the user accepts.
 *
 * The header names the columns: `id` (required), `body` (optional; checked against the sketch) and
 * `x`, `y`, `z` (required). Each coordinate's unit is in its header, `x (mm)` or `x (in)`; a column
 * without one takes the row's `units` column (mm or in). Column names and units are read in any case.
 */
import Papa from 'papaparse';
import type { Sketch } from '../schema/sketch';
import { MAX_COORDINATE_MM } from '../schema/sketchVocabulary';
import { unitToMm, type LengthUnit } from '../units';
import { HARDPOINT_AXES, type HardpointAxis } from './table';

/** A change smaller than this (mm) is no change: a table written in inches and read back moves nothing. */
export const IMPORT_TOLERANCE_MM = 0.001;

type Position = Record<HardpointAxis, number>;

/** A row that moves a pivot: its position before and after (mm), and the axes that move. */
export interface HardpointChange {
  row: number;
  id: string;
  body: string;
  from: Position;
  to: Position;
  moved: HardpointAxis[];
}

/** A row the import cannot use (or the header, row 1, when no row can be used), and why. */
export interface HardpointProblem {
  row: number;
  message: string;
}

export interface HardpointReading {
  /** rows that move a pivot, in row order */
  changes: HardpointChange[];
  /** ids of rows that match a pivot already where the table puts it */
  unchanged: string[];
  /** every problem, in row order; a row with problems changes nothing */
  problems: HardpointProblem[];
  /** pivots of the sketch the table does not list (they stay where they are) */
  notListed: string[];
}

const UNIT_WORDS: Record<string, LengthUnit> = {
  mm: 'mm',
  millimetre: 'mm',
  millimetres: 'mm',
  millimeter: 'mm',
  millimeters: 'mm',
  in: 'in',
  inch: 'in',
  inches: 'in',
  '"': 'in',
};

function unitOf(word: string): LengthUnit | null {
  return UNIT_WORDS[word.trim().toLowerCase()] ?? null;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
/** `x`, `x (mm)`, `x [in]`: the axis and the unit written in brackets, if any. */
const COORDINATE_HEADER = /^([xyz])\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?$/i;

interface Columns {
  id: number;
  body: number | null;
  units: number | null;
  axes: Record<HardpointAxis, { index: number; unit: LengthUnit | null }>;
}

/** The header's columns, or the problems that leave no row usable. */
function readHeader(cells: string[], row: number): { columns: Columns } | { problems: HardpointProblem[] } {
  const problems: string[] = [];
  const names = cells.map((c) => c.trim().toLowerCase());
  const find = (...wanted: string[]) => {
    const i = names.findIndex((n) => wanted.includes(n));
    return i < 0 ? null : i;
  };
  const id = find('id');
  if (id === null) problems.push("no 'id' column");
  const units = find('units', 'unit');
  const axes: Partial<Columns['axes']> = {};
  cells.forEach((raw, index) => {
    const m = COORDINATE_HEADER.exec(raw.trim());
    if (!m) return;
    const axis = m[1].toLowerCase() as HardpointAxis;
    if (axes[axis]) return void problems.push(`two columns for ${axis}`);
    const written = m[2];
    const unit = written === undefined ? null : unitOf(written);
    if (written !== undefined && unit === null)
      problems.push(`the ${axis} column's unit '${written}' is not one this import reads (mm or in)`);
    else if (unit === null && units === null)
      problems.push(`the ${axis} column names no unit: write '${axis} (mm)' or '${axis} (in)', or add a units column`);
    axes[axis] = { index, unit };
  });
  for (const a of HARDPOINT_AXES) if (!axes[a]) problems.push(`no column for ${a} (write '${a} (mm)' or '${a} (in)')`);
  if (problems.length) return { problems: problems.map((message) => ({ row, message })) };
  return { columns: { id: id!, body: find('body'), units, axes: axes as Columns['axes'] } };
}

/** One row's position in mm, or the row's problems. */
function readPosition(cells: string[], c: Columns): { at: Position } | { problems: string[] } {
  const problems: string[] = [];
  let rowUnit: LengthUnit | null = null;
  if (c.units !== null) {
    const word = (cells[c.units] ?? '').trim();
    rowUnit = word ? unitOf(word) : null;
    const needed = HARDPOINT_AXES.some((a) => c.axes[a].unit === null);
    if (needed && !word) problems.push('no unit in the units column');
    else if (word && rowUnit === null) problems.push(`unit '${word}' is not one this import reads (mm or in)`);
  }
  const at: Partial<Position> = {};
  for (const a of HARDPOINT_AXES) {
    const text = (cells[c.axes[a].index] ?? '').trim();
    if (!text) {
      problems.push(`no value for ${a}`);
      continue;
    }
    if (!NUMBER.test(text)) {
      problems.push(`${a} is '${text}', not a number`);
      continue;
    }
    const unit = c.axes[a].unit ?? rowUnit;
    if (!unit) continue;
    const mm = unitToMm(Number(text), unit);
    if (!Number.isFinite(mm) || Math.abs(mm) > MAX_COORDINATE_MM)
      problems.push(`${a} is ${text} ${unit}, beyond the ±${MAX_COORDINATE_MM} mm a sketch holds`);
    else at[a] = mm;
  }
  return problems.length ? { problems } : { at: at as Position };
}

/** Reads `text` (a CSV hardpoint table) against the pivots of `sketch`. */
export function readHardpoints(text: string, sketch: Pick<Sketch, 'points'>): HardpointReading {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: false });
  const reading: HardpointReading = { changes: [], unchanged: [], problems: [], notListed: [] };
  const badRows = new Map<number, string>();
  for (const e of parsed.errors)
    if (e.row !== undefined && e.code !== 'UndetectableDelimiter') badRows.set(e.row + 1, e.message);

  const rows = parsed.data.map((cells, i) => ({ row: i + 1, cells: cells.map((c) => String(c ?? '')) }));
  const filled = rows.filter((r) => r.cells.some((c) => c.trim() !== ''));
  const header = filled.shift();
  if (!header) {
    reading.problems.push({ row: 1, message: 'the file holds no table (no header row)' });
    return reading;
  }
  const head = readHeader(header.cells, header.row);
  if ('problems' in head) {
    reading.problems.push(...head.problems);
    return reading;
  }
  const c = head.columns;
  const pivots = new Map(sketch.points.map((p) => [p.id, p]));
  const seen = new Map<string, number>();
  for (const { row, cells } of filled) {
    const problems: string[] = [];
    const broken = badRows.get(row);
    if (broken) problems.push(`cannot be read as CSV (${broken})`);
    const id = (cells[c.id] ?? '').trim();
    const pivot = pivots.get(id);
    if (!id) problems.push('no id');
    else if (seen.has(id)) problems.push(`pivot '${id}' is already on row ${seen.get(id)}`);
    else if (!pivot) problems.push(`no pivot '${id}' in this sketch`);
    if (id && !seen.has(id)) seen.set(id, row);
    const body = c.body === null ? '' : (cells[c.body] ?? '').trim();
    if (pivot && body && body !== pivot.body)
      problems.push(`'${id}' is on the ${pivot.body} in the sketch, not the ${body}; an import does not change bodies`);
    const position = readPosition(cells, c);
    if ('problems' in position) problems.push(...position.problems);
    if (problems.length || !pivot || 'problems' in position) {
      reading.problems.push(...problems.map((message) => ({ row, message })));
      continue;
    }
    const from = { x: pivot.x, y: pivot.y, z: pivot.z };
    const moved = HARDPOINT_AXES.filter((a) => Math.abs(position.at[a] - from[a]) >= IMPORT_TOLERANCE_MM);
    if (!moved.length) {
      reading.unchanged.push(id);
      continue;
    }
    // Axes within the tolerance keep their exact value: reading a table back never drifts a pivot.
    const to = { ...from };
    for (const a of moved) to[a] = position.at[a];
    reading.changes.push({ row, id, body: pivot.body, from, to, moved });
  }
  reading.notListed = sketch.points.filter((p) => !seen.has(p.id)).map((p) => p.id);
  return reading;
}

/** Where the reading's changes put each pivot they move (mm), for the one edit that applies them. */
export function placementsOf(reading: HardpointReading): Map<string, Position> {
  return new Map(reading.changes.map((c) => [c.id, c.to]));
}
