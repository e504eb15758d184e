/**
 * The Metal panel's η–δ map: the named sheets (or the candidates listed in the Candidates panel) placed by the
 * substrate worker (one mesh spectrum each, with progress and stop), drawn by the figure code with the page's
 * sheet marked and the chosen metal brought forward.
 */
import { etaDeltaFigure, setMetalFocus } from '../../figures/etaDelta.ts';
import type { EtaDeltaData } from '../../figures/types.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import type { App } from '../app.ts';
import { parameterSet } from '../state.ts';
import { Cancelled, type WorkerLane } from '../worker/client.ts';

/** Mesh of the η–δ map: one mesh spectrum per candidate (the `metals` command's default). */
export const MAP_MESH = 24;
/** Most listed candidates placed on the map. */
export const MAP_MOST = 60;

/** A candidate as the Candidates panel lists it. */
export interface Listed {
  phase?: string;
  pattern: Pattern;
}

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

export class EtaDeltaMap {
  /** The map drawn (the export draws it again in the publication look). */
  map: EtaDeltaData | undefined;
  private key = '';
  /** The metal brought forward on the drawn map. */
  private focus = '';

  constructor(private readonly app: App, private readonly doc: Document, private readonly lane: WorkerLane, private readonly listed: () => readonly Listed[]) {
    $<HTMLButtonElement>(doc, '#map-cancel').addEventListener('click', () => lane.cancel());
    $<HTMLButtonElement>(doc, '#map-redraw').addEventListener('click', () => void this.update(true));
    for (const radio of doc.querySelectorAll<HTMLInputElement>('input[name="map-source"]')) radio.addEventListener('change', () => void this.update(true));
  }

  /** The patterns to place; `asked`: the user chose them (say so when there are none listed). */
  private patterns(asked: boolean): { patterns: { name?: string; pattern: Pattern }[]; note: string } {
    const source = this.doc.querySelector<HTMLInputElement>('input[name="map-source"]:checked')?.value;
    if (source === 'listed') {
      const listed = this.listed();
      if (listed.length > 0) {
        const patterns = listed.slice(0, MAP_MOST).map((c) => (c.phase ? { name: c.phase, pattern: c.pattern } : { pattern: c.pattern }));
        return { patterns, note: listed.length > MAP_MOST ? `the first ${MAP_MOST} of ${listed.length} listed candidates` : `${listed.length} listed candidates` };
      }
      if (asked) this.app.notices.show('no candidates are listed yet: the map shows the named sheets (list candidates in the Candidates panel first)', 'info');
    }
    return { patterns: SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern })), note: 'the named sheets' };
  }

  /** Places the candidates again when what the map depends on changed (or `force`); else redraws marks only if needed. */
  async update(force: boolean): Promise<void> {
    const state = this.app.state;
    const { patterns, note } = this.patterns(force);
    const current = { label: this.app.resolved.label, eta: this.app.resolved.eta };
    const key = JSON.stringify([patterns.map((p) => [p.name, p.pattern.vacancies, p.pattern.supercell]), state.params, state.smearing, state.metal.model]);
    if (key === this.key && !force) {
      // Only the mark of the page's sheet or the metal in focus may have changed (not on every slider frame).
      if (this.map && (this.map.current?.label !== current.label || this.map.current?.eta !== current.eta || this.focus !== state.metal.name)) {
        this.draw({ ...this.map, current });
      }
      return;
    }
    this.key = key;
    const progress = $<HTMLElement>(this.doc, '#map-progress');
    progress.hidden = false;
    progress.querySelector('span')!.textContent = `placing ${note}…`;
    try {
      const map = await this.lane.run<EtaDeltaData>('map', {
        patterns, params: parameterSet(state.params), smearing: state.smearing, mesh: MAP_MESH, model: state.metal.model, current,
      }, (done, total) => {
        progress.querySelector('progress')!.value = total > 0 ? done / total : 0;
        progress.querySelector('span')!.textContent = `${done} / ${total} patterns`;
      });
      this.draw({ ...map, current: { label: this.app.resolved.label, eta: this.app.resolved.eta } });
    } catch (error) {
      if (error instanceof Cancelled) this.key = '';
      else this.app.notices.show(`η–δ map: ${error instanceof Error ? error.message : String(error)}`);
    } finally {
      if (!this.lane.busy) progress.hidden = true;
    }
  }

  private draw(data: EtaDeltaData): void {
    this.map = data;
    const svg = etaDeltaFigure(data, { document: this.doc });
    this.focus = this.app.state.metal.name;
    setMetalFocus(svg, this.focus);
    $<HTMLElement>(this.doc, '#eta-delta-host').replaceChildren(svg);
  }
}
