import { zodResolver } from '@hookform/resolvers/zod';
import { Controller, type Control, type FieldValues, type Path, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { UNIT_SYSTEM_IDS, UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { Segmented } from '@/components/check/unit-switch';

/**
 * The unit switch of a form: a `units` field choosing the unit system every
 * `UnitNumberField` of the form is typed in (they re-type what was typed when
 * it changes). Starts at the person's choice or the site's default.
 */
export function UnitsField<T extends FieldValues, TOut = T>({
  control,
  name,
}: {
  control: Control<T, unknown, TOut>;
  name: Path<T>;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <Segmented<UnitSystem>
          label="Units"
          value={field.value as UnitSystem}
          onChange={field.onChange}
          options={UNIT_SYSTEM_IDS.map((u) => ({ value: u, label: UNIT_SYSTEMS[u].label }))}
        />
      )}
    />
  );
}

/**
 * react-hook-form's resolver for a form whose lengths are typed in the form's
 * own `units`: the shared zod schema is built for the units chosen at the
 * moment of validation (`schemaFor(units)`, typed text → metres), so what the
 * form hands to its submit handler is the API's input in SI units, and a
 * field error lands under the field of the same name.
 */
export function unitsResolver<In extends FieldValues & { units: UnitSystem }, Out>(
  schemaFor: (units: UnitSystem) => z.ZodType<Out>,
): Resolver<In, unknown, Out> {
  const schemas = new Map<UnitSystem, Resolver<In, unknown, Out>>();
  return (values, context, options) => {
    let resolver = schemas.get(values.units);
    if (!resolver) {
      resolver = zodResolver(schemaFor(values.units) as never) as unknown as Resolver<In, unknown, Out>;
      schemas.set(values.units, resolver);
    }
    return resolver(values, context, options);
  };
}
