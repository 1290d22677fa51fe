import { fireEvent, render, screen } from '@testing-library/react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';

describe('TextField', () => {
  it('shows its error under the input as an alert and marks the input invalid', () => {
    render(<TextField label="Height of eye" error="Must be 0 m or more." value="-3" onChangeText={() => {}} />);
    expect(screen.getByRole('alert').textContent).toBe('Must be 0 m or more.');
    const input = screen.getByLabelText('Height of eye');
    expect(input.getAttribute('aria-invalid')).toBe('true');
  });

  it('shows the hint when there is no error', () => {
    render(<TextField label="Distance" hint="Along the surface." value="" onChangeText={() => {}} />);
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.getByText('Along the surface.')).toBeTruthy();
  });
});

describe('Button', () => {
  it('calls onPress, and not when busy', () => {
    const onPress = jest.fn();
    const { rerender } = render(<Button label="Compute" onPress={onPress} />);
    fireEvent.click(screen.getByRole('button', { name: 'Compute' }));
    expect(onPress).toHaveBeenCalledTimes(1);
    rerender(<Button label="Compute" onPress={onPress} busy />);
    fireEvent.click(screen.getByRole('button', { name: 'Compute' }));
    expect(onPress).toHaveBeenCalledTimes(1);
  });
});
