import { TextField } from '@/components/text-field';

/** The width of the emission bands an analysis averages over, in nm (0: each wavelength on its own). */
export function BandWidthField({ value, onChange }: { value: string; onChange: (value: string) => void }) {
  return (
    <TextField
      label="Band width (nm)"
      hint="0 gives one band per wavelength"
      inputMode="decimal"
      value={value}
      onChange={(event) => onChange(event.target.value)}
    />
  );
}
