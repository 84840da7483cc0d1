/** Public surface of the column mechanics. */
export * from './types.js';
export { criticalLoad, criticalPhi } from './criticalLoad.js';
export { modeShape, modeCurvatureFactor } from './modeShape.js';
export { columnCapacity, capacityFromPcr, isStrengthModel } from './columnCapacity.js';
export { firstYieldCapacity } from './firstYield.js';
export { aiscCapacity, aiscCriticalStress, AISC_BRANCH_LIMIT } from './aisc360.js';
export { enCapacity, enReductionFactor, EN_IMPERFECTION, type EnCurve } from './en1993.js';
export {
  restraintRatio, stiffnessFromRatio, fixityFactor, ratioFromFixity, ratioFromAlignmentG,
} from './restraint.js';
export {
  makeFastCapacity, makeFastCapacityFromRatio, fastPhi, fastCurvatureFactor, fastTable, type FastCapacity,
} from './fastColumn.js';
export { en1993EquivalentBow, equivalentBowCapacity } from './equivalentBow.js';
export { strengthModelKind, strengthUsesBow, type StrengthModelKind } from './strengthModelKind.js';
export { defaultModelUncertainty, type ModelUncertaintyDefault } from './modelUncertainty.js';
export { steppedCriticalLoad, steppedCriticalPhi, steppedMode, type SteppedMember, type SteppedMode } from './steppedColumn.js';
export { steppedColumnCapacity } from './steppedCapacity.js';
