import { describe, expect, it } from 'vitest';
import { IMPORT_TOLERANCE_MM, readHardpoints } from '../../../shared/hardpoints/read';
import { hardpointsCsv } from '../../../shared/hardpoints/table';
import type { Sketch } from '../../../shared/schema/sketch';

/** Three pivots of an invented rear axle (mm). */
const sketch: Pick<Sketch, 'points'> = {
  points: [
    { id: 'LL.fl', body: 'frame', x: 980, y: 470, z: 330 },
    { id: 'LL.al', body: 'axle', x: 30, y: 470, z: 235 },
    { id: 'UL.fl', body: 'frame', x: 760, y: 440, z: 600 },
    { id: 'SH.al', body: 'axle', x: -60, y: 500, z: 250 },
  ],
};

const lines = (...rows: string[]) => rows.join('\r\n') + '\r\n';

describe('reading a hardpoint table', () => {
  it('reads back its own table, in mm and in inches, as no change at all', () => {
    for (const units of ['mm', 'in'] as const) {
      const r = readHardpoints(hardpointsCsv(sketch, units), sketch);
      expect(r.problems).toEqual([]);
      expect(r.changes).toEqual([]);
      expect(r.unchanged).toEqual(['LL.fl', 'LL.al', 'UL.fl', 'SH.al']);
      expect(r.notListed).toEqual([]);
    }
  });

  it('matches rows by id and gives old and new per coordinate, only the axes that move', () => {
    const r = readHardpoints(lines('id,body,x (mm),y (mm),z (mm)', 'UL.fl,frame,770,440,612.5'), sketch);
    expect(r.problems).toEqual([]);
    expect(r.changes).toEqual([
      {
        row: 2,
        id: 'UL.fl',
        body: 'frame',
        from: { x: 760, y: 440, z: 600 },
        to: { x: 770, y: 440, z: 612.5 },
        moved: ['x', 'z'],
      },
    ]);
    expect(r.notListed).toEqual(['LL.fl', 'LL.al', 'SH.al']);
  });

  it('converts inches at 25.4 mm each (exact by the 1959 definition) from the header unit', () => {
    // 10 in = 254 mm, 20 in = 508 mm, 30.5 in = 774.7 mm.
    const r = readHardpoints(lines('ID,X (in),Y (inches),Z [in]', 'LL.al,10,20,30.5'), sketch);
    expect(r.problems).toEqual([]);
    expect(r.changes[0].to.x).toBeCloseTo(254, 9);
    expect(r.changes[0].to.y).toBeCloseTo(508, 9);
    expect(r.changes[0].to.z).toBeCloseTo(774.7, 9);
  });

  it('takes the unit from a units column where the header names none', () => {
    const r = readHardpoints(lines('id,x,y,z,units', 'LL.fl,1,2,3,in', 'LL.al,31,471,236,mm'), sketch);
    expect(r.problems).toEqual([]);
    expect(r.changes.map((c) => [c.id, c.to])).toEqual([
      ['LL.fl', { x: 25.4, y: 50.8, z: 76.19999999999999 }],
      ['LL.al', { x: 31, y: 471, z: 236 }],
    ]);
  });

  it('keeps a coordinate within the tolerance exactly as it was', () => {
    const r = readHardpoints(
      lines('id,x (mm),y (mm),z (mm)', `LL.fl,${980 + IMPORT_TOLERANCE_MM / 2},470,340`),
      sketch,
    );
    expect(r.changes[0].to).toEqual({ x: 980, y: 470, z: 340 });
    expect(r.changes[0].moved).toEqual(['z']);
  });

  it('lists each row it cannot use by row number, with the reason, and uses the good rows', () => {
    const text = lines(
      'id,body,x (mm),y (mm),z (mm)',
      'LL.fl,frame,990,470,330', // row 2: good
      'XX.9,frame,1,2,3', // row 3: unknown id
      'LL.al,axle,abc,470,235', // row 4: text in a number column
      'UL.fl,frame,760,,600', // row 5: missing value
      '', // row 6: blank, skipped
      'LL.fl,frame,1000,470,330', // row 7: same id again
      'SH.al,frame,-60,500,250', // row 8: another body
      ',frame,1,2,3', // row 9: no id
    );
    const r = readHardpoints(text, sketch);
    expect(r.changes.map((c) => c.id)).toEqual(['LL.fl']);
    expect(r.problems).toEqual([
      { row: 3, message: "no pivot 'XX.9' in this sketch" },
      { row: 4, message: "x is 'abc', not a number" },
      { row: 5, message: 'no value for y' },
      { row: 7, message: "pivot 'LL.fl' is already on row 2" },
      {
        row: 8,
        message: "'SH.al' is on the axle in the sketch, not the frame; an import does not change bodies",
      },
      { row: 9, message: 'no id' },
    ]);
  });

  it('reports a unit it cannot read in a units column by row', () => {
    const r = readHardpoints(lines('id,x,y,z,units', 'LL.fl,1,2,3,cm', 'LL.al,1,2,3,'), sketch);
    expect(r.changes).toEqual([]);
    expect(r.problems).toEqual([
      { row: 2, message: "unit 'cm' is not one this import reads (mm or in)" },
      { row: 3, message: 'no unit in the units column' },
    ]);
  });

  it('reports missing columns and unreadable header units on the header row, and uses no row', () => {
    expect(readHardpoints(lines('id,x (mm),y (mm)', 'LL.fl,1,2'), sketch).problems).toEqual([
      { row: 1, message: "no column for z (write 'z (mm)' or 'z (in)')" },
    ]);
    expect(readHardpoints(lines('name,x (mm),y (mm),z (mm)', 'LL.fl,1,2,3'), sketch).problems).toEqual([
      { row: 1, message: "no 'id' column" },
    ]);
    const r = readHardpoints(lines('id,x (cm),y (mm),z', 'LL.fl,1,2,3'), sketch);
    expect(r.changes).toEqual([]);
    expect(r.problems).toEqual([
      { row: 1, message: "the x column's unit 'cm' is not one this import reads (mm or in)" },
      { row: 1, message: "the z column names no unit: write 'z (mm)' or 'z (in)', or add a units column" },
    ]);
  });

  it('refuses a coordinate beyond what a sketch holds, and an empty file', () => {
    const r = readHardpoints(lines('id,x (in),y (in),z (in)', 'LL.fl,5000,0,0'), sketch);
    expect(r.problems).toEqual([{ row: 2, message: 'x is 5000 in, beyond the ±100000 mm a sketch holds' }]);
    expect(readHardpoints('\r\n\r\n', sketch).problems).toEqual([
      { row: 1, message: 'the file holds no table (no header row)' },
    ]);
  });

  it('reads a table saved with a byte-order mark and semicolons, as some spreadsheets write it', () => {
    const r = readHardpoints('\uFEFFid;x (mm);y (mm);z (mm)\r\nLL.al;30;470;240\r\n', sketch);
    expect(r.problems).toEqual([]);
    expect(r.changes[0].to).toEqual({ x: 30, y: 470, z: 240 });
  });
});

describe('writing a hardpoint table', () => {
  it('writes one row per pivot with id and body quoted where needed', () => {
    const text = hardpointsCsv({ points: [{ id: 'A,1', body: 'frame', x: -0.00001, y: 1.23456789, z: 2 }] }, 'mm');
    // −0.00001 rounds to 0 at four places and is written 0, never -0.
    expect(text).toBe('id,body,x (mm),y (mm),z (mm)\r\n"A,1",frame,0,1.2346,2\r\n');
  });
});
