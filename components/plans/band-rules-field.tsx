import {
  Controller,
  get,
  useFieldArray,
  useFormState,
  useWatch,
  type ArrayPath,
  type Control,
  type FieldValues,
  type Path,
} from 'react-hook-form';
import { View } from 'react-native';
import type { ShoreBandRule } from '@/shared/schemas/plan';
import { Segmented } from '@/components/check/unit-switch';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FieldError } from '@/components/ui/field-error';
import { FieldRow } from '@/components/ui/field-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { space } from '@/components/ui/theme';

/** One band rule as typed on the plan form: numbers and hours as text until the form is saved. */
export interface BandRuleValues {
  band: string;
  minPosts: '1' | '2';
  minPct: string;
  /** Local time, "08:00" (or "8"). */
  fromHour: string;
  toHour: string;
}

const clock = (hour: number) => `${String(hour).padStart(2, '0')}:00`;

/** A stored rule as the form shows it. */
export const bandRuleValues = (rule: ShoreBandRule): BandRuleValues => ({
  band: rule.band,
  minPosts: String(rule.minPosts) as BandRuleValues['minPosts'],
  minPct: String(rule.minPct),
  fromHour: clock(rule.fromHour),
  toHour: clock(rule.toHour),
});

/**
 * An hour typed as "8", "08" or "08:00" (minutes other than :00 give a fraction, which the schema refuses as not a
 * whole hour); anything else is NaN, refused with the field's message.
 */
export function hourOf(text: string): number {
  const m = /^\s*(\d{1,2})(?:[:.h](\d{2}))?\s*$/.exec(text);
  return m ? Number(m[1]) + Number(m[2] ?? 0) / 60 : NaN;
}

const numberOf = (text: string) => (text.trim() === '' ? NaN : Number(text.replace(',', '.')));

/** The rules for the API (the plan schema checks them; its messages land under these fields). */
export const bandRulesOf = (rules: readonly BandRuleValues[]) =>
  rules.map((r) => ({
    band: r.band,
    minPosts: Number(r.minPosts),
    minPct: numberOf(r.minPct),
    fromHour: hourOf(r.fromHour),
    toHour: hourOf(r.toHour),
  }));

/** Where a schema or server path of the standard's band rules (`standard.bandRules.0.minPct`) shows on the form. */
export function bandRuleFieldOf(path: string): string | undefined {
  const m = /^standard\.bandRules(?:\.(\d+)(?:\.(band|minPosts|minPct|fromHour|toHour))?)?/.exec(path);
  if (!m) return undefined;
  if (m[1] === undefined) return 'bandRules.root';
  return `bandRules.${m[1]}.${m[2] ?? 'band'}`;
}

/** Words for one rule, e.g. "Inshore: 95 % of the shore by ≥ 1 post, 08:00–20:00". */
export function describeBandRule(r: BandRuleValues): string {
  const hours = hourOf(r.fromHour) === 0 && hourOf(r.toHour) === 24 ? 'all day' : `${r.fromHour}–${r.toHour}`;
  return `${r.band || 'A band'}: ${r.minPct || '…'} % of the shore by ≥ ${r.minPosts} post${r.minPosts === '1' ? '' : 's'}, ${hours}`;
}

/**
 * The standard's rules for a coast site's offshore bands, e.g. "Inshore: 95 % of the shore watched by ≥ 1 post
 * between 08:00 and 20:00" — met when every hour of the window reaches it in the run's hour-by-hour series (every post
 * counts when there is no roster). Bands come from the site; a rule naming a band the site no longer has keeps its
 * name until it is changed or removed.
 */
export function BandRulesField<T extends FieldValues>({
  control,
  name,
  bands,
}: {
  control: Control<T>;
  /** The form's array of `BandRuleValues`. */
  name: ArrayPath<T>;
  /** The site's band names, in order. */
  bands: readonly string[];
}) {
  const { fields, append, remove } = useFieldArray({ control, name });
  const typed = (useWatch({ control, name: name as Path<T> }) ?? []) as BandRuleValues[];
  const { errors } = useFormState({ control, name: name as Path<T> });
  // The array's own error (e.g. too many rules) sits on its `root`.
  const rootError = (get(errors, name) as { root?: { message?: string } } | undefined)?.root?.message;
  const at = (i: number, key: keyof BandRuleValues) => `${name}.${i}.${key}` as Path<T>;
  if (bands.length === 0 && fields.length === 0) return null;
  return (
    <View style={{ gap: space.sm }} aria-label="Rules per band">
      <AppText variant="label">Rules per offshore band</AppText>
      <AppText variant="small" tone="muted">
        Share of the shore along which the band is watched, in every hour of the window (local time at the site), from the roster.
        Watched means in view within the detection range: it is not detection. Estimates only; refraction near the horizon varies
        widely — follow your agency’s procedures.
      </AppText>
      {fields.map((f, i) => (
        <View key={f.id} style={{ gap: space.xs, paddingLeft: space.md }} aria-label={`Band rule ${i + 1}`}>
          <Controller
            control={control}
            name={at(i, 'band')}
            render={({ field, fieldState }) => {
              const value = field.value as string;
              const names = value && !bands.includes(value) ? [...bands, value] : bands;
              return (
                <View style={{ gap: space.xs }}>
                  <Segmented
                    label={`Rule ${i + 1}: band`}
                    value={value}
                    options={names.map((b) => ({ value: b, label: bands.includes(b) ? b : `${b} (not on this site)` }))}
                    onChange={field.onChange}
                  />
                  <FieldError message={fieldState.error?.message} />
                </View>
              );
            }}
          />
          <FieldRow minWidth={110}>
            <FormTextField control={control} name={at(i, 'minPct')} label="Share of the shore" unit="%" inputMode="decimal" />
            <FormTextField
              control={control}
              name={at(i, 'fromHour')}
              label="From"
              placeholder="08:00"
              inputMode="numeric"
              hint="Local time"
            />
            <FormTextField
              control={control}
              name={at(i, 'toHour')}
              label="To"
              placeholder="20:00"
              inputMode="numeric"
              hint="24:00 = midnight"
            />
          </FieldRow>
          <Controller
            control={control}
            name={at(i, 'minPosts')}
            render={({ field, fieldState }) => (
              <View style={{ gap: space.xs }}>
                <Segmented
                  label="Watched by at least"
                  value={field.value as BandRuleValues['minPosts']}
                  options={[
                    { value: '1', label: '1 post' },
                    { value: '2', label: '2 posts' },
                  ]}
                  onChange={field.onChange}
                />
                <FieldError message={fieldState.error?.message} />
              </View>
            )}
          />
          {typed[i] ? (
            <AppText variant="small" tone="muted">
              Reads: {describeBandRule(typed[i])}
            </AppText>
          ) : null}
          <Button kind="quiet" label={`Remove rule ${i + 1}`} onPress={() => remove(i)} style={{ alignSelf: 'flex-start' }} />
        </View>
      ))}
      {bands.length > 0 ? (
        <Button
          kind="quiet"
          label="Add a band rule"
          onPress={() => append({ band: bands[0]!, minPosts: '1', minPct: '90', fromHour: '00:00', toHour: '24:00' } as never)}
          style={{ alignSelf: 'flex-start' }}
        />
      ) : (
        <AppText variant="small" tone="muted">
          This site has no offshore bands now: add them on the site form to add rules.
        </AppText>
      )}
      <FieldError message={rootError} />
    </View>
  );
}
