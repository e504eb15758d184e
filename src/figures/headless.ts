/**
 * A headless DOM document for drawing figures in Node (the CLI and the tests), from linkedom. The web view never
 * imports this: it passes the page's own document.
 */
import { parseHTML } from 'linkedom';

export function headlessDocument(): Document {
  return parseHTML('<!doctype html><html><head></head><body></body></html>').document as unknown as Document;
}
