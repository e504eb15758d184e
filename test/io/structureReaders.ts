/**
 * Test helpers: tiny readers for the CIF and extended XYZ this project writes, enough to check them.
 * A CIF reader builds the cell the standard way from lengths and angles: a along x, b in the xy plane,
 * c completing a right-handed set (International Tables for Crystallography Vol. B, orthogonalisation with
 * a ∥ x, common practice).
 */

export interface ReadStructure {
  /** Cell rows A1, A2, A3 (Å). */
  readonly lattice: [number, number, number][];
  /** Cartesian positions (Å). */
  readonly positions: [number, number, number][];
  readonly species: string[];
}

export function readCif(text: string): ReadStructure & { values: Map<string, string> } {
  const values = new Map<string, string>();
  const lines = text.split('\n').map((line) => line.trim()).filter((line) => line.length > 0 && !line.startsWith('#'));
  const loops: { names: string[]; rows: string[][] }[] = [];
  for (let k = 0; k < lines.length; k++) {
    if (lines[k] === 'loop_') {
      const names: string[] = [];
      while (lines[k + 1]?.startsWith('_')) names.push(lines[++k]);
      const rows: string[][] = [];
      while (k + 1 < lines.length && !lines[k + 1].startsWith('_') && lines[k + 1] !== 'loop_' && !lines[k + 1].startsWith('data_')) {
        rows.push(lines[++k].match(/'[^']*'|\S+/g)!);
      }
      loops.push({ names, rows });
    } else if (lines[k].startsWith('_')) {
      const [, name, value] = lines[k].match(/^(\S+)\s+(.*)$/)!;
      values.set(name, value);
    }
  }
  const num = (name: string) => Number(values.get(name));
  const a = num('_cell_length_a'), b = num('_cell_length_b'), c = num('_cell_length_c');
  const rad = Math.PI / 180;
  const [alpha, beta, gamma] = [num('_cell_angle_alpha') * rad, num('_cell_angle_beta') * rad, num('_cell_angle_gamma') * rad];
  const cx = c * Math.cos(beta);
  const cy = (c * (Math.cos(alpha) - Math.cos(beta) * Math.cos(gamma))) / Math.sin(gamma);
  const lattice: [number, number, number][] = [
    [a, 0, 0],
    [b * Math.cos(gamma), b * Math.sin(gamma), 0],
    [cx, cy, Math.sqrt(c * c - cx * cx - cy * cy)],
  ];
  const atoms = loops.find((loop) => loop.names.includes('_atom_site_fract_x'))!;
  const col = (name: string) => atoms.names.indexOf(name);
  const positions = atoms.rows.map((row): [number, number, number] => {
    const f = [Number(row[col('_atom_site_fract_x')]), Number(row[col('_atom_site_fract_y')]), Number(row[col('_atom_site_fract_z')])];
    return [0, 1, 2].map((axis) => f[0] * lattice[0][axis] + f[1] * lattice[1][axis] + f[2] * lattice[2][axis]) as [number, number, number];
  });
  return { values, lattice, positions, species: atoms.rows.map((row) => row[col('_atom_site_type_symbol')]) };
}

export function readExtendedXyz(text: string): ReadStructure & { comment: Map<string, string> } {
  const lines = text.split('\n');
  const count = Number(lines[0]);
  const comment = new Map<string, string>();
  for (const [, key, quoted, bare] of lines[1].matchAll(/(\w+)=(?:"([^"]*)"|(\S+))/g)) comment.set(key, quoted ?? bare);
  const l = comment.get('Lattice')!.split(/\s+/).map(Number);
  const lattice: [number, number, number][] = [[l[0], l[1], l[2]], [l[3], l[4], l[5]], [l[6], l[7], l[8]]];
  const rows = lines.slice(2, 2 + count).map((line) => line.trim().split(/\s+/));
  return {
    comment,
    lattice,
    species: rows.map((row) => row[0]),
    positions: rows.map((row) => [Number(row[1]), Number(row[2]), Number(row[3])]),
  };
}
