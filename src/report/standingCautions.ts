/** The cautions every report carries, whatever the numbers. */
export const STANDING_CAUTIONS: readonly string[] = [
  'This tool supports, and does not replace, the judgement of a licensed engineer, who remains responsible for the assessment.',
  'Local codes, the authority having jurisdiction and licensed practice govern; a reliability index computed here is one input to that decision, not a code compliance check.',
  'Results are only as good as the input statistics: the distributions, their parameters and correlations, and the model factor must be justified for this structure (tests, records, surveys).',
  'The mechanical model covers a prismatic column with elastic end springs about one buckling axis (or about both principal axes, each on its own, the smaller capacity governing), loaded axially or with the end eccentricities, end moments, line load along the height, top force and out-of-plumb given, all in the plane of bending about y and all scaled together (first-yield, and the code interaction checks of EN 1993-1-1 Eq. 6.61 and AISC 360 H1-1); it ignores, among others, lateral-torsional and local buckling, connection strength and deterioration unless the inputs reflect them (a corrosion loss given in the section does).',
];
