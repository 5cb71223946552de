import { DecimalField } from './decimal-field';

/** The typed settings of an absorption titration's analysis: band width (nm), path length (cm), [E]0 (µM, may be empty). */
export interface TitrationSettings {
  bandWidth: string;
  pathLength: string;
  emitterMicromolar: string;
}

/**
 * The three settings as fields, for a new titration or, with `again`, as the new values for a kept
 * one (the labels then say "New …" and the hints are shorter: the first reading explained them).
 */
export function TitrationSettingsFields({
  settings,
  onChange,
  again = false,
}: {
  settings: TitrationSettings;
  onChange: (settings: TitrationSettings) => void;
  again?: boolean;
}) {
  const set = (key: keyof TitrationSettings) => (value: string) => onChange({ ...settings, [key]: value });
  const named = (what: string) => (again ? `New ${what}` : `${what.charAt(0).toUpperCase()}${what.slice(1)}`);
  return (
    <>
      <DecimalField
        label={named('band width (nm)')}
        hint={again ? undefined : '0 gives one band per wavelength'}
        value={settings.bandWidth}
        onChange={set('bandWidth')}
      />
      <DecimalField label={named('path length (cm)')} value={settings.pathLength} onChange={set('pathLength')} />
      <DecimalField
        label={named('emitter concentration (µM)')}
        hint={
          again
            ? 'Empty: [Q] taken as in large excess'
            : 'For the exact 1:1 isotherm and Δε; leave empty if [Q] is in large excess'
        }
        value={settings.emitterMicromolar}
        onChange={set('emitterMicromolar')}
      />
    </>
  );
}
