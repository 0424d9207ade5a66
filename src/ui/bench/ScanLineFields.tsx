import { NumberField, SelectField } from '../components/Field';
import type { FieldErrors } from './engineErrors';
import { scanModes, type ScanLineInputs, type ScanMode } from './scanLine';

/** Choice of scan line with its width or resolution setting. */
export function ScanLineFields(props: { idPrefix: string; values: ScanLineInputs; errors: FieldErrors; onChange: (patch: Partial<ScanLineInputs>) => void }) {
  const { values, errors, idPrefix } = props;
  const mode = values.mode as ScanMode;
  return (
    <div class="fieldset-grid">
      <SelectField id={`${idPrefix}-mode`} label="Scan line" value={mode} options={scanModes} onChange={(v) => props.onChange({ mode: v })} />
      {mode === 'constant-width' && (
        <>
          <NumberField id={`${idPrefix}-width`} label="Peak width Δm" unit="u" value={values.width} error={errors.width}
            onInput={(t) => props.onChange({ width: t })} hint="Ideal band width (base to base), set exactly at the reference m/z." />
          <NumberField id={`${idPrefix}-ref`} label="Reference m/z" unit="u" value={values.referenceMz} error={errors.referenceMz}
            onInput={(t) => props.onChange({ referenceMz: t })} />
        </>
      )}
      {mode === 'constant-resolution' && (
        <NumberField id={`${idPrefix}-resolution`} label="Resolution m/Δm" value={values.resolution} error={errors.resolution}
          onInput={(t) => props.onChange({ resolution: t })} hint="Ideal band: centre divided by width." />
      )}
    </div>
  );
}
