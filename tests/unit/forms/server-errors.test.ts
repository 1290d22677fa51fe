import { ApiRequestError } from '@/components/data/api-client';
import { applyServerErrors } from '@/components/data/server-errors';

// Behaviour of Kenning's own form helper: no outside source.
describe('applyServerErrors', () => {
  const error = new ApiRequestError(400, 'invalid_input', 'The site has invalid fields.', {
    name: 'Name the site.',
    'priorityZones.1.ring': 'The ring crosses itself near 60.10000, 12.15000 (latitude, longitude).',
    'boundary.3': 'Give the corners as [longitude, latitude] pairs.',
  });

  it('puts each server reason under the deepest listed field it lies in, and leaves no message when all are placed', () => {
    const setError = jest.fn();
    const message = applyServerErrors(error, setError, ['name', 'boundary', 'priorityZones', 'priorityZones.1.ring'] as never);
    expect(message).toBe('');
    expect(setError).toHaveBeenCalledWith('name', { type: 'server', message: 'Name the site.' }, { shouldFocus: true });
    expect(setError).toHaveBeenCalledWith(
      'priorityZones.1.ring',
      { type: 'server', message: expect.stringMatching(/crosses itself/) },
      expect.anything(),
    );
    expect(setError).toHaveBeenCalledWith(
      'boundary',
      expect.objectContaining({ message: expect.stringMatching(/pairs/) }),
      expect.anything(),
    );
  });

  it('returns the server message when a reason has no field on the form, or with a mapping function', () => {
    const setError = jest.fn();
    expect(applyServerErrors(error, setError, ['name'] as never)).toBe('The site has invalid fields.');
    expect(setError).toHaveBeenCalledTimes(1);
    const mapped = jest.fn();
    expect(
      applyServerErrors(error, mapped, (path: string) => (path.startsWith('boundary') ? 'boundary' : undefined) as never),
    ).toBe('The site has invalid fields.');
    expect(mapped).toHaveBeenCalledTimes(1);
  });

  it('says what went wrong for errors that are not API field errors', () => {
    expect(applyServerErrors(new ApiRequestError(409, 'stale_version', 'Someone else changed this.'), jest.fn(), [])).toBe(
      'Someone else changed this.',
    );
    expect(applyServerErrors(new Error('offline'), jest.fn(), [])).toBe('offline');
    expect(applyServerErrors('??', jest.fn(), [])).toBe('Something went wrong.');
  });
});
