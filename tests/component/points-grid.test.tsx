import { fireEvent, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { PointsGrid } from '@/features/studies/components/points-grid';
import { answerFetch, renderWithClient } from './support/render';
import { labId, point, studyDetail } from './support/study-fixture';

const cell = (row: number, column: string) => screen.getByLabelText<HTMLInputElement>(`Row ${row} ${column}`);

describe('PointsGrid', () => {
  it('when saved points open, then [Q] shows in mM, and another unit converts what is typed', async () => {
    renderWithClient(<PointsGrid labId={labId} study={studyDetail()} editable />);
    expect(cell(2, 'Concentration').value).toBe('1'); // 0.001 M
    await userEvent.selectOptions(screen.getByLabelText('Concentration unit'), 'uM');
    expect(cell(2, 'Concentration').value).toBe('1000');
    expect(screen.getByRole('columnheader', { name: '[Q] (µM)' })).toBeTruthy();
  });

  it('when a block is pasted from a spreadsheet, then it fills the rows and columns from that cell on', () => {
    renderWithClient(<PointsGrid labId={labId} study={studyDetail()} editable />);
    fireEvent.paste(cell(3, 'Concentration'), { clipboardData: { getData: () => '2\t700\r\n4\t610\r\n' } });
    expect([cell(3, 'Concentration').value, cell(3, 'Intensity').value]).toEqual(['2', '700']);
    expect([cell(4, 'Concentration').value, cell(4, 'Intensity').value]).toEqual(['4', '610']);
    // One empty row stays at the end for the next value, and only one.
    expect(cell(5, 'Concentration').value).toBe('');
    expect(screen.queryByLabelText('Row 6 Concentration')).toBeNull();
  });

  it('when a cell is not a number, then saving names its row and column and sends nothing', async () => {
    renderWithClient(<PointsGrid labId={labId} study={studyDetail()} editable />);
    await userEvent.clear(cell(1, 'Intensity'));
    await userEvent.type(cell(1, 'Intensity'), 'bright');
    await userEvent.click(screen.getByRole('button', { name: 'Save points and fit' }));
    expect(screen.getByText('Row 1, Intensity: "bright" is not a number.')).toBeTruthy();
    expect(fetch).not.toHaveBeenCalled();
  });

  it('when the points are saved, then the series goes out in SI units with the version it was edited from', async () => {
    const saved = studyDetail({ version: 4, points: [point(0, 0, 1000), point(1, 0.001, 800), point(2, 0.002, 650)] });
    const calls = answerFetch(saved);
    renderWithClient(<PointsGrid labId={labId} study={studyDetail()} editable />);
    await userEvent.type(cell(3, 'Concentration'), '2');
    await userEvent.type(cell(3, 'Intensity'), '650');
    await userEvent.type(cell(3, 'Lifetime (ns)'), '700');
    await userEvent.click(screen.getByRole('button', { name: 'Save points and fit' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    const [call] = calls;
    expect(call?.method).toBe('PATCH');
    expect(call?.url).toBe(`/api/labs/${labId}/studies/${saved.id}/points`);
    const body = call?.body as { version: number; points: { concentration: number; lifetime: number | null }[] };
    expect(body.version).toBe(3);
    expect(body.points.map((p) => p.concentration)).toEqual([0, 0.001, 0.002]);
    expect(body.points[2]?.lifetime).toBeCloseTo(7e-7, 15); // 700 ns in s
  });

  it('when the study cannot be edited, then the points are a plain table with nothing to type in and nothing to save', () => {
    const { container } = renderWithClient(
      <PointsGrid labId={labId} study={studyDetail({ status: 'approved' })} editable={false} />,
    );
    expect(screen.getByRole('table', { name: 'Points' })).toBeTruthy();
    expect(container.querySelectorAll('input, select, textarea')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: 'Save points and fit' })).toBeNull();
  });

  it('when a series has 400 points, then the grid shows 50 rows at a time and keeps edits made on other pages', () => {
    const long = Array.from({ length: 400 }, (_, i) => point(i, i * 1e-5, 1000 - i));
    renderWithClient(<PointsGrid labId={labId} study={studyDetail({ points: long })} editable />);
    // 400 points and the empty row for the next value: 401 rows, 50 in the page.
    expect(screen.getAllByLabelText(/^Row \d+ Concentration$/)).toHaveLength(50);
    expect(screen.getByText('Rows 1–50 of 401')).toBeTruthy();
    fireEvent.change(cell(2, 'Intensity'), { target: { value: '999.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Next rows' }));
    expect(screen.getByText('Rows 51–100 of 401')).toBeTruthy();
    expect(screen.queryByLabelText('Row 2 Intensity')).toBeNull();
    expect(cell(51, 'Intensity').value).toBe('950');
    fireEvent.click(screen.getByRole('button', { name: 'Previous rows' }));
    expect(cell(2, 'Intensity').value).toBe('999.5');
  }, 20_000);
});
