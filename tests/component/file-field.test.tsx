import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FileField } from '@/components/file-field';
import { ACCEPTED_EXTENSIONS } from '../../server/services/studies/parse/read-upload';

describe('FileField', () => {
  it('when no type is given, then the picker offers exactly the instrument exports the server reads', () => {
    render(<FileField label="Spectra file" fileName={null} onFile={() => undefined} />);
    const input = screen.getByLabelText<HTMLInputElement>('Spectra file');
    // The server's list (server/services/studies/parse/read-upload.ts) is what refuses a file with 415.
    expect(input.accept.split(',').sort()).toEqual([...ACCEPTED_EXTENSIONS].sort());
  });

  it('when a type is given, then only that type is offered and the chosen name is shown', () => {
    render(
      <FileField label="CSV file to import" accept=".csv,text/csv" fileName="library.csv" onFile={() => undefined} />,
    );
    expect(screen.getByLabelText<HTMLInputElement>('CSV file to import').accept).toBe('.csv,text/csv');
    expect(screen.getByText('library.csv')).toBeTruthy();
  });
});
