/**
 * Bands, DOS and zone in the page: drawn by src/figures, made interactive here. The doping slider moves E_F
 * through `setFermi` on the drawn figures (no re-render, no diagonalisation); a click on the bands picks a
 * Bloch state; hovering reads out the k-point, E − E_F and the σ share.
 */
import { bandsFigure, bandsPick } from '../../figures/bands.ts';
import { dosFigure } from '../../figures/dos.ts';
import { setFermi, setRule } from '../../figures/energyPlot.ts';
import { zoneFigure } from '../../figures/zone.ts';
import type { SpectraData } from '../../figures/types.ts';

/** The end of the current task: lets input and rendering in before the next piece of work. */
export const nextTask = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 0));

export interface SpectrumViewEvents {
  pick(kIndex: number, band: number): void;
}

/** Where along the path a k index lies: at a special point, or between two. */
export function pathPlace(labels: readonly { label: string; index: number }[], kIndex: number): string {
  for (let s = 0; s < labels.length; s++) {
    if (labels[s].index === kIndex) return labels[s].label;
    if (s + 1 < labels.length && kIndex > labels[s].index && kIndex < labels[s + 1].index) {
      const share = (kIndex - labels[s].index) / (labels[s + 1].index - labels[s].index);
      return `${labels[s].label}–${labels[s + 1].label}, ${(100 * share).toFixed(0)}% of the way`;
    }
  }
  return `point ${kIndex}`;
}

export class SpectrumView {
  bandsSvg: SVGSVGElement | undefined;
  dosSvg: SVGSVGElement | undefined;
  zoneSvg: SVGSVGElement | undefined;
  private data: SpectraData | undefined;
  private fermi = 0;
  private rule: number | undefined;
  private generation = 0;
  private readonly tooltip: HTMLDivElement;

  constructor(
    private readonly hosts: { bands: HTMLElement; dos: HTMLElement; zone: HTMLElement },
    private readonly events: SpectrumViewEvents,
  ) {
    this.tooltip = hosts.bands.ownerDocument.createElement('div');
    this.tooltip.className = 'tooltip';
    this.tooltip.hidden = true;
  }

  /** The energy window shown: the user's, or the whole spectrum with a margin. */
  static energyRange(data: SpectraData, low?: number, high?: number): [number, number] {
    let min = Infinity;
    let max = -Infinity;
    for (const e of data.path.energies) {
      if (e < min) min = e;
      if (e > max) max = e;
    }
    const lo = low ?? Math.floor(min - 0.5);
    const hi = high ?? Math.ceil(max + 0.5);
    return hi > lo ? [lo, hi] : [lo, lo + 1];
  }

  /**
   * Draws bands, DOS and zone one task apart, so that no single task holds the page for long (the main thread
   * stays free for input between them). A newer draw supersedes one still in progress; resolves false then.
   * A doping change during the draw is honoured: each figure takes the latest E_F.
   */
  async draw(data: SpectraData, options: { energyRange: [number, number]; selected?: { kIndex: number; band: number }; ruleEnergy?: number }): Promise<boolean> {
    const generation = ++this.generation;
    const doc = this.hosts.bands.ownerDocument;
    this.data = data;
    this.fermi = data.fermi;
    this.rule = options.ruleEnergy;
    const bandsWidth = Math.max(360, Math.min(760, this.hosts.bands.clientWidth || 520));
    const dosWidth = Math.max(140, this.hosts.dos.clientWidth || 170);
    const height = Math.round(Math.max(360, Math.min(560, bandsWidth * 0.85)));
    this.bandsSvg = bandsFigure(data, { document: doc, style: 'screen', width: bandsWidth, height, energyRange: options.energyRange, selected: options.selected });
    this.hosts.bands.replaceChildren(this.bandsSvg, this.tooltip);
    this.attach(this.bandsSvg);
    setRule(this.bandsSvg, this.rule ?? null);
    await nextTask();
    if (generation !== this.generation) return false;
    this.dosSvg = dosFigure(data, { document: doc, style: 'screen', width: dosWidth, height, energyRange: options.energyRange });
    if (this.fermi !== data.fermi) setFermi(this.dosSvg, this.fermi);
    setRule(this.dosSvg, this.rule ?? null);
    this.hosts.dos.replaceChildren(this.dosSvg);
    await nextTask();
    if (generation !== this.generation) return false;
    this.zoneSvg = zoneFigure(data, { document: doc, style: 'screen', width: 170, height: 170, selectedK: options.selected ? [data.path.kpoints[2 * options.selected.kIndex], data.path.kpoints[2 * options.selected.kIndex + 1]] : undefined });
    this.hosts.zone.replaceChildren(this.zoneSvg);
    return true;
  }

  /** Moves E_F on both figures (a doping-slider frame: attribute and clip updates only). */
  setFermi(fermi: number): void {
    this.fermi = fermi;
    if (this.bandsSvg) setFermi(this.bandsSvg, fermi);
    if (this.dosSvg) setFermi(this.dosSvg, fermi);
  }

  /** The dotted line where the counting rule's doping would put E_F (bands and DOS). */
  setRule(energy: number | undefined): void {
    this.rule = energy;
    if (this.bandsSvg) setRule(this.bandsSvg, energy ?? null);
    if (this.dosSvg) setRule(this.dosSvg, energy ?? null);
  }

  private attach(svg: SVGSVGElement): void {
    svg.addEventListener('click', (event) => {
      const picked = this.pickAt(svg, event);
      if (picked) this.events.pick(picked.kIndex, picked.band);
    });
    svg.addEventListener('pointermove', (event) => {
      const picked = this.pickAt(svg, event);
      const data = this.data;
      if (!picked || !data) {
        this.tooltip.hidden = true;
        return;
      }
      const row = picked.kIndex * data.path.bands + picked.band;
      const energy = data.path.energies[row];
      const sigma = data.path.sigmaWeight[row];
      const relative = energy - this.fermi;
      this.tooltip.textContent = `${pathPlace(data.path.labels, picked.kIndex)} · E − E_F = ${relative >= 0 ? '+' : '−'}${Math.abs(relative).toFixed(3)} eV · σ ${(100 * sigma).toFixed(0)}%`;
      const box = this.hosts.bands.getBoundingClientRect();
      this.tooltip.style.left = `${Math.min(event.clientX - box.left + 12, box.width - 260)}px`;
      this.tooltip.style.top = `${event.clientY - box.top + 14}px`;
      this.tooltip.hidden = false;
    });
    svg.addEventListener('pointerleave', () => (this.tooltip.hidden = true));
  }

  private pickAt(svg: SVGSVGElement, event: MouseEvent): { kIndex: number; band: number } | undefined {
    const matrix = svg.getScreenCTM();
    if (!matrix) return undefined;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    return this.data ? bandsPick(svg, this.data, point.x, point.y) : undefined;
  }
}
