import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { PostInputSchema } from '@/shared/schemas/site';
import { typedToMetres } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { ApiRequestError } from '@/components/data/api-client';
import { applyServerErrors } from '@/components/data/server-errors';
import { Button } from '@/components/ui/button';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { UnitsField, unitsResolver } from '@/components/ui/units-field';

interface Values {
  units: UnitSystem;
  eyeHeightM: string;
}
type Out = { units: UnitSystem; eyeHeightM: number };

/** A one-field form built the way Kenning's forms are: the shared schema, lengths typed in the form's units. */
const schemaFor = (units: UnitSystem) =>
  z.object({
    units: z.enum(['metric', 'nautical', 'imperial']),
    eyeHeightM: z.preprocess((t) => typedToMetres(t, UNIT_SYSTEMS[units].height) ?? undefined, PostInputSchema.shape.eyeHeightM),
  });

function Harness({ onSave, serverError }: { onSave: (out: Out) => void; serverError?: unknown }) {
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, watch } = useForm<Values, unknown, Out>({
    resolver: unitsResolver<Values, Out>(schemaFor),
    defaultValues: { units: 'metric', eyeHeightM: '1.6' },
  });
  const save = handleSubmit((out) => {
    onSave(out);
    if (serverError) setFormError(applyServerErrors(serverError, setError, ['eyeHeightM']));
  });
  return (
    <>
      <UnitsField control={control} name="units" />
      <UnitNumberField control={control} name="eyeHeightM" label="Eye height" unit={UNIT_SYSTEMS[watch('units')].height} />
      <Button label="Save" onPress={() => void save()} />
      {formError ? <span>{formError}</span> : null}
    </>
  );
}

const input = () => screen.getByLabelText('Eye height') as HTMLInputElement;

describe('UnitNumberField', () => {
  it('takes what is typed and hands metres to the save', async () => {
    const onSave = jest.fn();
    render(<Harness onSave={onSave} />);
    fireEvent.change(input(), { target: { value: '2.5' } });
    expect(input().value).toBe('2.5');
    expect(screen.getByText('m')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    // Source: metres typed in metres are stored as typed (no conversion).
    expect(onSave.mock.calls[0][0].eyeHeightM).toBe(2.5);
  });

  it('re-types what was typed when the unit changes, labels the new unit, and saves metres', async () => {
    const onSave = jest.fn();
    render(<Harness onSave={onSave} />);
    fireEvent.change(input(), { target: { value: '1.75' } });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · nmi' }));
    // Source: 1.75 m / 0.3048 m/ft = 5.741… ft (NIST SP 811 B.8), shown to three significant digits.
    await waitFor(() => expect(input().value).toBe('5.74'));
    expect(screen.getByText('ft')).toBeTruthy();
    fireEvent.change(input(), { target: { value: '5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    // Source: NIST SP 811 B.8, 5 ft = 1.524 m exactly (tolerance 1e-12 m).
    expect(Math.abs(onSave.mock.calls[0][0].eyeHeightM - 1.524)).toBeLessThan(1e-12);
    // Back to metres: the same length again.
    fireEvent.click(screen.getByRole('radio', { name: 'm · km' }));
    await waitFor(() => expect(input().value).toBe('1.52'));
  });

  it('gives back what was typed when switching back without editing (no rounding drift)', async () => {
    render(<Harness onSave={() => {}} />);
    fireEvent.change(input(), { target: { value: '15.24' } });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · mi' }));
    // Source: 15.24 m / 0.3048 = 50 ft exactly (NIST SP 811 B.8).
    await waitFor(() => expect(input().value).toBe('50'));
    fireEvent.click(screen.getByRole('radio', { name: 'm · km' }));
    await waitFor(() => expect(input().value).toBe('15.24'));
    fireEvent.change(input(), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('radio', { name: 'ft · nmi' }));
    // Source: 2 m / 0.3048 = 6.5617 ft, three significant digits (the edited text is converted, not restored).
    await waitFor(() => expect(input().value).toBe('6.56'));
  });

  it('shows the schema’s error under the field, in the unit typed', async () => {
    const onSave = jest.fn();
    render(<Harness onSave={onSave} />);
    fireEvent.click(screen.getByRole('radio', { name: 'ft · mi' }));
    await waitFor(() => expect(input().value).toBe('5.25'));
    fireEvent.change(input(), { target: { value: '40' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    // Source: the shared post schema's 10 m eye-height limit; 10 m / 0.3048 = 32.8 ft.
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe('Eye height must be at most 32.8 ft.'));
    expect(onSave).not.toHaveBeenCalled();
    expect(input().getAttribute('aria-invalid')).toBe('true');
    expect(input().value).toBe('40');
  });

  it('puts the server’s field error under the field, restated in the unit typed, and keeps what was typed', async () => {
    const serverError = new ApiRequestError(400, 'invalid_input', 'Check the highlighted fields.', {
      eyeHeightM: 'Eye height must be at most 10 m.',
    });
    render(<Harness onSave={() => {}} serverError={serverError} />);
    fireEvent.click(screen.getByRole('radio', { name: 'ft · nmi' }));
    await waitFor(() => expect(input().value).toBe('5.25'));
    fireEvent.change(input(), { target: { value: '6' } });
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    });
    await waitFor(() => expect(screen.getByRole('alert').textContent).toBe('Eye height must be at most 32.8 ft.'));
    expect(input().value).toBe('6');
  });
});
