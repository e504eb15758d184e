/** The figures: data preparation, the figures, their live updates and SVG text. Re-exports only. */
export * from './types.ts';
export * from './prepare.ts';
export { bandsFigure, bandsPick, bandsScales, setSelected, spectraEnergyRange, type BandsOptions } from './bands.ts';
export { dosFigure, type DosOptions } from './dos.ts';
export { zoneFigure, setZoneMarker, type ZoneOptions } from './zone.ts';
export { sheetFigure, type SheetOptions } from './sheet.ts';
export { setFermi, setRule } from './energyPlot.ts';
export { stmPictureFigure, wrapWords } from './stmPicture.ts';
export * from './prepareStm.ts';
export { etaDeltaFigure, metalMarker, setMetalFocus, type EtaDeltaOptions } from './etaDelta.ts';
export { calibrationFigure } from './calibration.ts';
export * from './prepareCalibration.ts';
export { svgText, serializeFigure } from './serialize.ts';
export { SIGMA_COLOUR, PI_COLOUR, shareColour, phaseColour } from './palette.ts';
export { FONT_FAMILY } from './look.ts';
