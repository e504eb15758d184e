/**
 * The electron count beside the figures: what the counting rule asks of this η, where the model's σ bonding
 * states are just filled, and what the current doping gives — the reasoning a user tests on any pattern.
 */
import type { SigmaBondingResult } from '../../tb/sigmaBonding.ts';
import { nextMesh } from '../../tb/sigmaBondingRefine.ts';
import { labelledRow } from './tableRows.ts';

export interface CountFigures {
  eta: number;
  etaEstimated: boolean;
  atoms: number;
  holesPerSites?: [number, number];
  ruleDoping: number;
  /** E at which the counting rule's electrons fill the sheet (E_F at the rule's doping), eV. */
  ruleEnergy?: number;
  bonding?: SigmaBondingResult;
  doping: number;
  fermi?: number;
  sigma?: number;
  pi?: number;
  bandEnergy?: number;
  parameters: string;
  /** The mesh and why (meshDensity.ts's sentence). */
  mesh: string;
  smearing: number;
}

const signed = (x: number, digits = 3) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}`;

export function drawCountBox(host: HTMLElement, figures: CountFigures): void {
  const doc = host.ownerDocument;
  const rows: [string, string, string?][] = [];
  const holes = figures.holesPerSites ? ` (${figures.holesPerSites[0]} of ${figures.holesPerSites[1]} sites)` : '';
  rows.push(['hole density η', `${figures.eta.toFixed(4)}${figures.etaEstimated ? ' (estimate)' : ''}${holes}`]);
  rows.push(['atoms per cell', String(figures.atoms)]);
  rows.push(['counting rule asks δ', `${signed(figures.ruleDoping)} e/atom`, 'δ = 8/(3(1 − η)) − 3: the classic estimate of the doping that just fills the σ bonding states']);
  if (figures.ruleEnergy !== undefined) rows.push(['E_F at the rule\u2019s δ', `${figures.ruleEnergy.toFixed(3)} eV`, 'the dotted line marked “rule” on the bands and DOS']);
  const bonding = figures.bonding;
  if (bonding) {
    const where = bonding.gap ? `gap ${bonding.gap.lower.toFixed(2)} … ${bonding.gap.upper.toFixed(2)} eV` : `pseudogap at ${bonding.energy.toFixed(2)} eV`;
    rows.push(['model fills σ bonding at δ', `${signed(bonding.fillingDoping)} e/atom`, `the model's σ bonding states end in a ${where}`]);
    if (bonding.fillingRange) rows.push(['… any δ between', `${signed(bonding.fillingRange.lower)} and ${signed(bonding.fillingRange.upper)}`, 'keeps σ bonding full and σ antibonding empty']);
    if (!bonding.convergence.converged) {
      rows.push(['not converged at this mesh', `try mesh ${nextMesh(bonding.mesh)}`, `the σ count from the mesh states and from the bands interpolated between them differ (${signed(bonding.convergence.fillingDoping)} e/atom interpolated): the mesh is too coarse for this analysis`]);
    }
  }
  rows.push(['doping now δ', `${signed(figures.doping)} e/atom`, 'positive: electrons given by the metal']);
  if (figures.fermi !== undefined) rows.push(['Fermi level E_F', `${figures.fermi.toFixed(3)} eV`]);
  if (figures.sigma !== undefined && figures.pi !== undefined) rows.push(['σ / π electrons per atom', `${figures.sigma.toFixed(3)} / ${figures.pi.toFixed(3)}`]);
  if (figures.bandEnergy !== undefined) rows.push(['band energy per atom', `${figures.bandEnergy.toFixed(4)} eV`, 'compare only between patterns of equal η']);
  const table = doc.createElement('table');
  const body = table.createTBody();
  for (const [name, value, title] of rows) body.append(labelledRow(doc, name, value, title));
  const caveat = doc.createElement('p');
  caveat.className = 'caveat';
  caveat.textContent = `Model: ${figures.parameters}, ${figures.mesh}, Gaussian width ${figures.smearing} eV. The rule is a rule of thumb and the model an estimate (universal parameters bind σ states too strongly for boron); experiment and higher-level calculations decide.`;
  host.replaceChildren(table, caveat);
}
