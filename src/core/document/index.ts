/**
 * The documents: the engine's workspace (types, validation), the workbench document with quotes as
 * typed, the bridge between them, reserved keys, caps, file checks and migration.
 */
export * from './types.ts';
export * from './plainObject.ts';
export * from './validate.ts';
export * from './namedCurves.ts';
export * from './namedCurveEdits.ts';
export * from './limits.ts';
export * from './documentKeys.ts';
export * from './document.ts';
export * from './workbenchDocument.ts';
export * from './workbenchShape.ts';
export * from './documentBridge.ts';
export * from './listFile.ts';
export { customCalendarNameProblem } from './calendarSection.ts';
