export * from './sectionProperties.js';
export * from './sectionDimensions.js';
export { defaultCornerRadii, type HollowFinish } from './cornerRadii.js';
