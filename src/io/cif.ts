/**
 * A sheet as a CIF (IUCr Crystallographic Information File, core dictionary names), space group P 1.
 *
 * The cell is given by lengths and angles, so a reader builds it with a along x and b in the xy plane;
 * c = the vacuum spacing along z (α = β = 90°). Fractional x, y are those of the written cell; fractional
 * z = z / c (heights about the sheet's plane, so a reader's Cartesian z equals the sheet's z).
 * A left-handed cell (only with reduce: false) would be read as its mirror image, so its heights are
 * negated: the reader then gets the sheet turned by 180° about its first vector, a rigid motion.
 */
import { cellMetrics } from '../lattice/reducedCell.ts';
import { signedArea, type Sheet } from '../lattice/sheet.ts';
import { exportFrame, fixed, safeName, type StructureExportOptions } from './exportFrame.ts';

/** The CIF text of `sheet`. */
export function sheetToCif(sheet: Sheet, options: StructureExportOptions = {}): string {
  const { frame, vacuum } = exportFrame(sheet, options);
  const { a, b, gammaDeg, area } = cellMetrics(frame.cell);
  const flip = signedArea(frame.cell) < 0 ? -1 : 1;
  const lines = [
    `data_${safeName(sheet.name)}`,
    `_chemical_formula_sum 'B${frame.atoms.length}'`,
    `_cell_length_a ${fixed(a, 6)}`,
    `_cell_length_b ${fixed(b, 6)}`,
    `_cell_length_c ${fixed(vacuum, 6)}`,
    '_cell_angle_alpha 90',
    '_cell_angle_beta 90',
    `_cell_angle_gamma ${fixed(gammaDeg, 6)}`,
    `_cell_volume ${fixed(area * vacuum, 6)}`,
    "_symmetry_space_group_name_H-M 'P 1'",
    '_symmetry_Int_Tables_number 1',
    'loop_',
    '_space_group_symop_operation_xyz',
    "'x, y, z'",
    'loop_',
    '_atom_site_label',
    '_atom_site_type_symbol',
    '_atom_site_fract_x',
    '_atom_site_fract_y',
    '_atom_site_fract_z',
    ...frame.atoms.map(([f1, f2, z], k) => `B${k + 1} B ${fixed(f1, 8)} ${fixed(f2, 8)} ${fixed((flip * z) / vacuum, 8)}`),
  ];
  return `${lines.join('\n')}\n`;
}
