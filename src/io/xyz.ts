/**
 * A sheet as an extended XYZ file: atom count, a comment line of key=value pairs
 * (Lattice="A1x A1y A1z A2x A2y A2z A3x A3y A3z" with A3 the vacuum vector along z,
 * Properties=species:S:1:pos:R:3, pbc="T T F"), then one `B x y z` line per atom in Å.
 * Positions are Cartesian in the export frame (src/io/exportFrame.ts: first cell vector along +x), the same
 * frame a CIF reader builds from sheetToCif.
 */
import { cartesian, type Sheet } from '../lattice/sheet.ts';
import { exportFrame, fixed, type StructureExportOptions } from './exportFrame.ts';

/** The extended XYZ text of `sheet`. */
export function sheetToXyz(sheet: Sheet, options: StructureExportOptions = {}): string {
  const { frame, vacuum } = exportFrame(sheet, options);
  const [[ax, ay], [bx, by]] = frame.cell;
  const lattice = [ax, ay, 0, bx, by, 0, 0, 0, vacuum].map((x) => fixed(x, 8)).join(' ');
  const lines = [
    String(frame.atoms.length),
    `Lattice="${lattice}" Properties=species:S:1:pos:R:3 pbc="T T F"`,
    ...frame.atoms.map((_, k) => {
      const [x, y, z] = cartesian(frame, k);
      return `B ${fixed(x, 8)} ${fixed(y, 8)} ${fixed(z, 8)}`;
    }),
  ];
  return `${lines.join('\n')}\n`;
}
