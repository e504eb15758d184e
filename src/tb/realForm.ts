/**
 * A real symmetric form of H(k) for a sheet with a 2-fold axis: V such that Vᴴ·H(k)·V is real at every k.
 *
 * Why it exists: the 2-fold rotation C₂ (x, y, z) → (−x, −y, z) combined with time reversal is an antiunitary
 * symmetry that squares to +1 and keeps k, and such a symmetry makes a Hermitian matrix unitarily equivalent to a
 * real symmetric one (Wigner's theorem on antiunitary operators; in band theory the "PT" or "C₂T" reality
 * condition). A real eigenproblem costs about half the complex one here (src/linalg/symmetricEigenvalues.ts).
 *
 * Derivation. C₂ sends atom a to P(a) (a permutation) and bond vector r to −r (in-plane), and the Slater–Koster
 * block E_αβ to π_α·π_β·E_αβ with parities π = +1 for s and pz, −1 for px and py. With the Bloch sum of model.ts,
 * H_{P(a)α, P(b)β}(k) = π_α·π_β·H_{aα, bβ}(k)*. So A = U·K (U: e_{aα} → π_α·e_{P(a)α}, K complex conjugation)
 * commutes with H and A² = 1. The vectors fixed by A form a real basis in which H is real:
 *   a ≠ P(a), π = +1:  (e_{aα} + e_{P(a)α})/√2  and  i·(e_{aα} − e_{P(a)α})/√2;
 *   a ≠ P(a), π = −1:  i·(e_{aα} + e_{P(a)α})/√2  and  (e_{aα} − e_{P(a)α})/√2;
 *   a = P(a):           e_{aα} (π = +1)  or  i·e_{aα} (π = −1).
 * Each column of V has one or two entries, so the change of basis costs O(n²), against O(n³) for the solve.
 */
import type { SheetOperation } from '../lattice/sheetSymmetry.ts';
import type { HamiltonianBlock, TightBindingModel } from './model.ts';

/** C₂ parity of orbital s, px, py, pz (in that order). */
const PARITY = [1, -1, -1, 1];
const BLOCK_ORBITALS: Record<HamiltonianBlock, number[]> = { full: [0, 1, 2, 3], sigma: [0, 1, 2], pi: [3] };

/**
 * The change of basis V for one block, as groups: a pair of atoms gives, per orbital, a group of two rows
 * (e, e′) and two columns (sum, difference); an atom on the axis gives a group of one row and one column.
 * Group g: rows rowA[g], rowB[g] (= rowA for a one-row group), columns column[g] … column[g] + width[g] − 1,
 * coefficients V[row, column] in coefficient[8g + 4·(row 0|1) + 2·(column 0|1) + (re 0|im 1)].
 */
export class RealForm {
  readonly size: number;
  private readonly groups: number;
  private readonly rowA: Int32Array;
  private readonly rowB: Int32Array;
  private readonly column: Int32Array;
  private readonly width: Int32Array;
  private readonly coefficient: Float64Array;

  constructor(atomMap: Int32Array, block: HamiltonianBlock) {
    const orbitals = BLOCK_ORBITALS[block];
    const perAtom = orbitals.length;
    this.size = perAtom * atomMap.length;
    const capacity = this.size;
    this.rowA = new Int32Array(capacity);
    this.rowB = new Int32Array(capacity);
    this.column = new Int32Array(capacity);
    this.width = new Int32Array(capacity);
    this.coefficient = new Float64Array(8 * capacity);
    const half = Math.SQRT1_2;
    let g = 0;
    let column = 0;
    const set = (row: 0 | 1, col: 0 | 1, re: number, im: number) => {
      this.coefficient[8 * g + 4 * row + 2 * col] = re;
      this.coefficient[8 * g + 4 * row + 2 * col + 1] = im;
    };
    for (let atom = 0; atom < atomMap.length; atom++) {
      const partner = atomMap[atom];
      if (partner < atom) continue; // the pair was built from its lower atom
      for (let o = 0; o < perAtom; o++) {
        const even = PARITY[orbitals[o]] === 1;
        this.rowA[g] = perAtom * atom + o;
        this.column[g] = column;
        if (partner === atom) {
          // e (even) or i·e (odd).
          this.rowB[g] = this.rowA[g];
          this.width[g] = 1;
          if (even) set(0, 0, 1, 0);
          else set(0, 0, 0, 1);
        } else {
          this.rowB[g] = perAtom * partner + o;
          this.width[g] = 2;
          if (even) {
            // (e + e′)/√2 and i·(e − e′)/√2.
            set(0, 0, half, 0); set(1, 0, half, 0);
            set(0, 1, 0, half); set(1, 1, 0, -half);
          } else {
            // i·(e + e′)/√2 and (e − e′)/√2.
            set(0, 0, 0, half); set(1, 0, 0, half);
            set(0, 1, half, 0); set(1, 1, -half, 0);
          }
        }
        column += this.width[g];
        g++;
      }
    }
    this.groups = g;
  }

  /**
   * out = Vᴴ·H·V (real part; the imaginary part vanishes by construction), H split row-major as from
   * model.hamiltonian; all of out is written. With `outIm`, the imaginary part is written too (tests).
   * One pass over 2×2 blocks of H: each block meets the coefficients of its two groups.
   */
  transform(re: Float64Array, im: Float64Array, out: Float64Array, outIm?: Float64Array): void {
    const n = this.size;
    const { groups, rowA, rowB, column, width, coefficient: w } = this;
    for (let g = 0; g < groups; g++) {
      const a1 = rowA[g] * n;
      const a2 = rowB[g] * n;
      const gw = 8 * g;
      const gCol = column[g];
      const gWidth = width[g];
      for (let h = 0; h <= g; h++) {
        const b1 = rowA[h];
        const b2 = rowB[h];
        const hw = 8 * h;
        // The 2×2 block of H on rows (a1, a2), columns (b1, b2).
        const h11r = re[a1 + b1], h11i = im[a1 + b1];
        const h12r = re[a1 + b2], h12i = im[a1 + b2];
        const h21r = re[a2 + b1], h21i = im[a2 + b1];
        const h22r = re[a2 + b2], h22i = im[a2 + b2];
        const hCol = column[h];
        const hWidth = width[h];
        for (let j = 0; j < hWidth; j++) {
          // T[·][j] = H_block · W_h[·][j].
          const x1r = w[hw + 2 * j], x1i = w[hw + 2 * j + 1];
          const x2r = w[hw + 4 + 2 * j], x2i = w[hw + 4 + 2 * j + 1];
          const t1r = h11r * x1r - h11i * x1i + h12r * x2r - h12i * x2i;
          const t1i = h11r * x1i + h11i * x1r + h12r * x2i + h12i * x2r;
          const t2r = h21r * x1r - h21i * x1i + h22r * x2r - h22i * x2i;
          const t2i = h21r * x1i + h21i * x1r + h22r * x2i + h22i * x2r;
          for (let a = 0; a < gWidth; a++) {
            // Re(conj(W_g[·][a])·T[·][j]).
            const y1r = w[gw + 2 * a], y1i = w[gw + 2 * a + 1];
            const y2r = w[gw + 4 + 2 * a], y2i = w[gw + 4 + 2 * a + 1];
            const value = y1r * t1r + y1i * t1i + y2r * t2r + y2i * t2i;
            const rowIndex = gCol + a;
            const colIndex = hCol + j;
            out[rowIndex * n + colIndex] = value;
            out[colIndex * n + rowIndex] = value;
            if (outIm) {
              const imaginary = y1r * t1i - y1i * t1r + y2r * t2i - y2i * t2r;
              outIm[rowIndex * n + colIndex] = imaginary;
              outIm[colIndex * n + rowIndex] = -imaginary;
            }
          }
        }
      }
    }
  }
}

/** The sheet's 2-fold rotation, if it has one (sheetOperations lists it as a rotation by 180°). */
export function twofoldRotation(operations: readonly SheetOperation[]): SheetOperation | undefined {
  return operations.find((o) => o.kind === 'rotation' && o.degrees === 180);
}

/** The real form of one block of the model's H(k), or undefined when the sheet has no 2-fold axis. */
export function realForm(model: TightBindingModel, block: HamiltonianBlock): RealForm | undefined {
  const twofold = twofoldRotation(model.operations);
  return twofold && new RealForm(twofold.atomMap, block);
}
