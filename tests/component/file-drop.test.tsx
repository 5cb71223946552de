import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FileDrop } from '@/features/studies/components/file-drop';
import { ACCEPTED_EXTENSIONS } from '../../server/services/studies/parse/read-upload';

describe('FileDrop', () => {
  it('when it offers a file, then the picker offers exactly the instrument exports the server reads', () => {
    render(<FileDrop label="Instrument export" fileName={null} progress={null} onFile={() => undefined} />);
    const input = screen.getByLabelText<HTMLInputElement>('Instrument export');
    // The server's list (server/services/studies/parse/read-upload.ts) is what refuses a file with 415.
    expect(input.accept.split(',').sort()).toEqual([...ACCEPTED_EXTENSIONS].sort());
  });
});
