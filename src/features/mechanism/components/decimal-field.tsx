import { TextField } from '@/components/text-field';

interface DecimalFieldProps {
  label: string;
  hint?: string;
  value: string;
  /** the text as typed: the sender reads it (typedNumber) or sends it, so the server names a bad entry */
  onChange: (value: string) => void;
}

/** A number typed with the decimal keypad, kept as text until it is sent. */
export function DecimalField({ label, hint, value, onChange }: DecimalFieldProps) {
  return (
    <TextField
      label={label}
      hint={hint}
      inputMode="decimal"
      value={value}
      onChange={(event) => onChange(event.target.value)}
    />
  );
}

/** The width of the emission bands an analysis averages over, in nm (0: each wavelength on its own). */
export function BandWidthField({ value, onChange }: { value: string; onChange: (value: string) => void }) {
  return (
    <DecimalField label="Band width (nm)" hint="0 gives one band per wavelength" value={value} onChange={onChange} />
  );
}
