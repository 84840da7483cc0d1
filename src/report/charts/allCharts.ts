/** Every chart the report holds, in reading order; charts without data are left out. */
import type { ReportInput } from '../reportInput.js';
import type { UnitSystem } from '../displayUnits.js';
import type { ChartSpec } from './chartSpec.js';
import { modeShapesChart } from './modeShapes.js';
import { mcConvergenceChart } from './mcConvergence.js';
import { samplesHistogramChart } from './samplesHistogram.js';
import { tornadoUtilizationChart } from './tornadoUtilization.js';
import { tornadoCapacityChart } from './tornadoCapacity.js';
import { conditionalBetaChart } from './conditionalBetaTornado.js';
import { importanceChart } from './importanceFactors.js';
import { restraintCurveChart } from './restraintCurve.js';
import { sweepChart } from './sweep.js';
import { restraintContourChart } from './restraintContour.js';
import { restraintCovChart } from './restraintCov.js';
import { measurementDensityChart } from './measurementDensity.js';
import { testPlansChart } from './testPlans.js';

export function buildCharts(input: ReportInput, system: UnitSystem): ChartSpec[] {
  const charts: ChartSpec[] = [];
  if (input.check.modeShapes.length > 0) charts.push(modeShapesChart(input, system));
  if (input.samples && input.samples.resistance.length > 0) charts.push(samplesHistogramChart(input, input.samples, system));
  if (input.reliability.mc && input.reliability.mc.convergence.length > 0) charts.push(mcConvergenceChart(input, input.reliability.mc));
  if (input.sensitivity.utilization.rows.length > 0) charts.push(tornadoUtilizationChart(input));
  if (input.sensitivity.capacity.rows.length > 0) charts.push(tornadoCapacityChart(input, system));
  if (input.sensitivity.conditionalBeta.rows.length > 0) charts.push(conditionalBetaChart(input));
  if (input.sensitivity.importance.length > 0) charts.push(importanceChart(input));
  if (input.restraint && input.restraint.curve.some((p) => p.ideal === undefined)) charts.push(restraintCurveChart(input, input.restraint, system));
  if (input.restraint?.contour && input.restraint.contour.segments.length > 0) charts.push(restraintContourChart(input, input.restraint, system));
  if (input.restraint?.covCurve && input.restraint.covCurve.points.some((p) => p.mean !== null)) charts.push(restraintCovChart(input, input.restraint, system));
  (input.measurements?.densities ?? []).forEach((d, i) => { if (d.points.length > 1) charts.push(measurementDensityChart(d, i, system)); });
  if (input.testPlans && input.testPlans.plans.some((r) => Number.isFinite(r.beta05))) charts.push(testPlansChart(input, input.testPlans));
  if (input.sweep && input.sweep.rows.length > 0) charts.push(sweepChart(input, input.sweep, system));
  return charts;
}
