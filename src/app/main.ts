/**
 * The page's entry: the starting view (the URL hash if there is one, else the embedded demo scenario), the
 * controller, the panels, and the page-wide keys. Everything it shows is computed by the core (src/), in its
 * workers: the model worker (bands, DOS, filling, states), the search worker (enumeration, ranking), the substrate
 * worker (the Metal panel), the STM worker (the STM panel) and the expansion worker (the Energies panel).
 */
import demo from '../../presets/demo/harbour-lab.json' with { type: 'json' };
import { App } from './app.ts';
import { Notices } from './panels/notices.ts';
import { wireControls, readNumber } from './panels/controls.ts';
import { CandidatesPanel } from './panels/candidatesPanel.ts';
import { nextTask } from './panels/spectrumView.ts';
import { wireExports } from './panels/exportsPanel.ts';
import { MetalPanel } from './panels/metalPanel.ts';
import { StmPanel } from './panels/stmPanel.ts';
import { EnergiesPanel } from './panels/energiesPanel.ts';
import { UnfoldPanel } from './panels/unfoldPanel.ts';
import { whenNear } from './panels/whenNear.ts';
import { CalibratePanel } from './panels/calibratePanel.ts';
import { defaultState, readHash, type ViewState } from './state.ts';
import { ValidationError } from '../validate/invalid.ts';

const $ = <T extends Element>(selector: string) => document.querySelector<T>(selector)!;

/** The demo scenario (invented, labelled DEMO): its sheet, and the candidate search for its measured cell. */
function demoState(): ViewState {
  const state = defaultState();
  const measured = demo.measured_periodicity;
  state.sheet = { kind: 'preset', name: demo.sheet };
  state.search = {
    sites: [1, 12],
    holes: [1, 3],
    isolated: true,
    cell: { a: measured.a_angstrom, b: measured.b_angstrom, gamma: measured.gamma_deg, lengthTolerance: measured.uncertainty_angstrom, angleTolerance: 3 },
  };
  return state;
}

const notices = new Notices($('#notices'));
const opensDemo = location.hash.replace(/^#/, '') === '';
let initial = demoState();
if (!opensDemo) {
  const { state, errors } = readHash(location.hash, defaultState());
  initial = state;
  for (const error of errors) notices.show(`${error.message} — that part of the link was ignored`);
}

const app = new App(
  initial,
  {
    sheetHost: $('#sheet-host'),
    bandsHost: $('#bands-host'),
    dosHost: $('#dos-host'),
    zoneHost: $('#zone-host'),
    countBox: $('#count-box'),
    summary: $('#summary'),
    sheetReadout: $('#sheet-readout'),
    stateReadout: $('#state-readout'),
    progress: $('#model-progress'),
  },
  notices,
  localStorage,
  () => new Worker(new URL('./worker/modelWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-model' }),
);
wireControls(app, document);
// The panels are built one task apart, so that starting the page never holds the main thread for long.
await nextTask();
const candidates = new CandidatesPanel(app, document, () => new Worker(new URL('./worker/searchWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-search' }));
await nextTask();
const metal = new MetalPanel(app, document, () => new Worker(new URL('./worker/substrateWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-substrate' }), () => candidates.listed);
await nextTask();
const stm = new StmPanel(app, document, () => new Worker(new URL('./worker/stmWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-stm' }));
wireExports(app, document, metal, stm);
await nextTask();
const unfold = new UnfoldPanel(app, document, () => new Worker(new URL('./worker/unfoldWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-unfold' }));
await nextTask();
const energies = new EnergiesPanel(app, document, () => new Worker(new URL('./worker/expansionWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-expansion' }));
await nextTask();
const calibrate = new CalibratePanel(app, document, () => new Worker(new URL('./worker/calibrateWorker.ts', import.meta.url), { type: 'module', name: 'lacuna-calibrate' }));

if (opensDemo) {
  const note = $<HTMLElement>('#demo-note');
  note.hidden = false;
  note.textContent = `${demo.title}: ${demo.lab}, sample ${demo.sample} on Ag(111) — a measured ${demo.measured_periodicity.a_angstrom} × ${demo.measured_periodicity.b_angstrom} Å cell at ${demo.measured_periodicity.gamma_deg}°. ${demo.question}`;
}

// Page-wide controls.
$<HTMLButtonElement>('#undo').addEventListener('click', () => app.undo());
$<HTMLButtonElement>('#redo').addEventListener('click', () => app.redo());
$<HTMLButtonElement>('#reset-view').addEventListener('click', () => app.sheetView.fit());
$<HTMLButtonElement>('#model-cancel').addEventListener('click', () => {
  app.model.cancel();
  $<HTMLElement>('#model-progress').hidden = true;
  notices.show('stopped: the figures show the last finished computation', 'info');
});
const guide = $<HTMLButtonElement>('#guide-toggle');
guide.addEventListener('click', () => {
  const on = guide.getAttribute('aria-pressed') !== 'true';
  guide.setAttribute('aria-pressed', String(on));
  for (const box of document.querySelectorAll<HTMLElement>('.explain')) box.hidden = !on;
});
for (const id of ['#energy-low', '#energy-high']) {
  $<HTMLInputElement>(id).addEventListener('change', () => {
    const low = $<HTMLInputElement>('#energy-low');
    const high = $<HTMLInputElement>('#energy-high');
    try {
      const lo = low.value.trim() === '' ? undefined : readNumber(low, 'lowest energy shown', -1000, 1000);
      const hi = high.value.trim() === '' ? undefined : readNumber(high, 'highest energy shown', -1000, 1000);
      if (lo !== undefined && hi !== undefined && !(hi > lo)) throw new ValidationError('highest energy shown', String(hi), 'must lie above the lowest');
      app.setEnergyWindow(lo, hi);
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      notices.show(error.message);
    }
  });
}
document.addEventListener('keydown', (event) => {
  if (!(event.ctrlKey || event.metaKey) || event.key.toLowerCase() !== 'z') return;
  if ((event.target as Element).closest('input, textarea, select')) return;
  event.preventDefault();
  if (event.shiftKey) app.redo();
  else app.undo();
});
// A link pasted into the address bar, or the browser's back and forward: the new view, old one undoable.
window.addEventListener('hashchange', () => {
  const { state, errors } = readHash(location.hash, defaultState());
  for (const error of errors) notices.show(`${error.message} — that part of the link was ignored`);
  app.history.record(app.state);
  candidates.fillForm(state.search);
  void app.replace(state);
});

// For the browser test and the benchmark it prints: the controller and its timings.
(window as unknown as { lacuna: unknown }).lacuna = { app, candidates, metal, stm, energies, unfold, calibrate };

void app.start().then(() => {
  if (opensDemo) void candidates.search();
  // The DEMO fits far down the page start when their panels come near the viewport (whenNear.ts).
  whenNear($('section.energies-panel'), () => energies.start());
  whenNear($('section.calibrate-panel'), () => void calibrate.start());
});
