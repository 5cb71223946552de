import { describe, expect, it } from 'vitest';
import { chartColours } from '@/components/chart-theme';
import { leftOutSeries, lineSeries, pointSeries } from '@/components/scatter-chart';

// The dataset options every plot builds its measured points and curves from (chart.js scatter datasets).
describe('pointSeries, lineSeries and leftOutSeries', () => {
  const data = [
    { x: 0, y: 1 },
    { x: 1, y: 2 },
  ];

  it('when points are drawn, then they are filled marks of the colour and no line joins them', () => {
    const points = pointSeries('τ0/τ', data, '#123456');
    expect(points).toEqual({ label: 'τ0/τ', data, backgroundColor: '#123456', pointRadius: 5 });
    expect(pointSeries('Counts', data, '#123456', 1.2).pointRadius).toBe(1.2);
  });

  it('when a curve is drawn, then it is a line without marks, and its width is chart.js’s unless given', () => {
    const curve = lineSeries('Fit', data, '#654321');
    expect(curve).toEqual({ label: 'Fit', data, borderColor: '#654321', showLine: true, pointRadius: 0 });
    // common practice: leaving the key out keeps the library's default width (an undefined value would override it)
    expect('borderWidth' in curve).toBe(false);
    expect(lineSeries('Fit', data, '#654321', 1.5).borderWidth).toBe(1.5);
  });

  it('when points are left out of a fit, then they are unfilled crosses in the left-out colour, named so in the legend', () => {
    expect(leftOutSeries(data)).toEqual({
      label: 'Left out',
      data,
      backgroundColor: 'transparent',
      borderColor: chartColours.excluded,
      pointStyle: 'crossRot',
      pointRadius: 7,
      borderWidth: 2,
    });
  });
});
