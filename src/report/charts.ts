/**
 * The report's key charts, built from the engine's results: curves over time (people infected,
 * deaths per day, ICU beds in use against capacity when present) and profiles by age band
 * (attack rate, deaths). Totals over bands are plain sums of the engine's by-band series.
 */
import { totalOverBands, type OptionResults, type ScenarioResults } from '../engine/index.ts';
import { dayAxisTitle, formatAxisValue, print } from './numberFormat.ts';
import { optionStyle, type OptionStyle } from './palette.ts';
import { lineChartSvg, type ChartSeries } from './svgLineChart.ts';

export interface ReportChart {
  id: string;
  heading: string;
  /** One sentence saying what is drawn, with units. */
  caption: string;
  svg: string;
}

/** How option k is drawn; by position unless the caller keeps colours per option. */
export type StyleOf = (k: number) => OptionStyle;

function seriesOf(results: ScenarioResults, values: (o: OptionResults) => ArrayLike<number>, styleOf: StyleOf): ChartSeries[] {
  return results.options.map((o, k) => ({ name: o.name, style: styleOf(k), values: values(o) }));
}

export function curveCharts(results: ScenarioResults, styleOf: StyleOf = optionStyle): ReportChart[] {
  const charts: ReportChart[] = [
    {
      id: 'prevalence',
      heading: 'People infected over time',
      caption: 'Persons currently infected (latent or infectious), all ages, by day.',
      svg: lineChartSvg({
        title: 'People infected by day, each option',
        xLabel: dayAxisTitle('Day', results.startDate),
        yLabel: 'Persons infected',
        series: seriesOf(results, (o) => totalOverBands(o.series.prevalence, o.series.bands), styleOf),
        yFormat: formatAxisValue,
      }),
    },
    {
      id: 'deaths',
      heading: 'Deaths per day',
      caption: 'Deaths per day, all ages (infections spread over the infection-to-death delay).',
      svg: lineChartSvg({
        title: 'Deaths per day, each option',
        xLabel: dayAxisTitle('Day', results.startDate),
        yLabel: 'Deaths per day',
        series: seriesOf(results, (o) => o.series.deaths, styleOf),
        yFormat: formatAxisValue,
      }),
    },
  ];
  const hospital = results.options.find((o) => o.healthcare !== null)?.healthcare ?? null;
  if (hospital !== null) {
    const lines = [{ value: hospital.icu.capacityBeds, label: `ICU capacity ${print.persons(hospital.icu.capacityBeds)} beds` }];
    if (hospital.icu.surgeCapacityBeds !== null) lines.push({ value: hospital.icu.surgeCapacityBeds, label: `surge ${print.persons(hospital.icu.surgeCapacityBeds)} beds` });
    charts.push({
      id: 'icu',
      heading: 'ICU beds in use',
      caption: 'ICU beds in use (mean over each day) against capacity, dotted lines.',
      svg: lineChartSvg({
        title: 'ICU beds in use by day, each option, with capacity',
        xLabel: dayAxisTitle('Day', results.startDate),
        yLabel: 'ICU beds in use',
        series: seriesOf(results, (o) => o.healthcare?.series.icuOccupancy ?? new Float64Array(0), styleOf),
        referenceLines: lines,
        yFormat: formatAxisValue,
      }),
    });
  }
  return charts;
}

export function byAgeCharts(results: ScenarioResults, styleOf: StyleOf = optionStyle): ReportChart[] {
  return [
    {
      id: 'attack-rate-by-age',
      heading: 'Attack rate by age band',
      caption: 'Share of each age band infected by the end of the horizon, %.',
      svg: lineChartSvg({
        title: 'Attack rate by age band, each option',
        xLabel: 'Age band (years)',
        yLabel: 'Attack rate, %',
        categories: results.ageBands,
        series: seriesOf(results, (o) => o.attackRateByBand.map((a) => 100 * a), styleOf),
        yFormat: (v) => `${formatAxisValue(v)}%`,
      }),
    },
    {
      id: 'deaths-by-age',
      heading: 'Deaths by age band',
      caption: 'Deaths caused by the infections within the horizon, persons, by age band.',
      svg: lineChartSvg({
        title: 'Deaths by age band, each option',
        xLabel: 'Age band (years)',
        yLabel: 'Deaths',
        categories: results.ageBands,
        series: seriesOf(results, (o) => o.deathsByBand, styleOf),
        yFormat: formatAxisValue,
      }),
    },
  ];
}
