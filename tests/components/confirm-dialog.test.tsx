import { fireEvent, render, screen } from '@testing-library/react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { VerdictSummary } from '@/components/plans/verdict-summary';
import { standardVerdict } from '@/shared/plans/standard-verdict';

const base = {
  title: 'Deactivate Ada Venn?',
  consequence: 'Ada Venn is signed out at once and can no longer sign in.',
  confirmLabel: 'Deactivate',
};

describe('ConfirmDialog', () => {
  it('says what will happen and names the action on its button', () => {
    render(<ConfirmDialog visible {...base} onConfirm={() => {}} onCancel={() => {}} />);
    const dialog = screen.getByRole('dialog', { name: 'Deactivate Ada Venn?' });
    expect(dialog.textContent).toContain('signed out at once');
    expect(screen.getByRole('button', { name: 'Deactivate' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Cancel' })).toBeTruthy();
  });

  it('calls onConfirm on the action and onCancel on Cancel, nothing else', () => {
    const onConfirm = jest.fn();
    const onCancel = jest.fn();
    render(<ConfirmDialog visible {...base} onConfirm={onConfirm} onCancel={onCancel} />);
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(onCancel).toHaveBeenCalledTimes(1);
    expect(onConfirm).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole('button', { name: 'Deactivate' }));
    expect(onConfirm).toHaveBeenCalledTimes(1);
  });

  it('shows nothing while closed', () => {
    render(<ConfirmDialog visible={false} {...base} onConfirm={() => {}} onCancel={() => {}} />);
    expect(screen.queryByRole('dialog')).toBeNull();
  });

  it('keeps the action off while busy or until what it asks for is given, and shows the last error', () => {
    const onConfirm = jest.fn();
    const { rerender } = render(
      <ConfirmDialog visible {...base} busy error="The server refused." onConfirm={onConfirm} onCancel={() => {}} />,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Deactivate' }));
    expect(screen.getByRole('alert').textContent).toBe('The server refused.');
    rerender(<ConfirmDialog visible {...base} confirmDisabled onConfirm={onConfirm} onCancel={() => {}} />);
    fireEvent.click(screen.getByRole('button', { name: 'Deactivate' }));
    expect(onConfirm).not.toHaveBeenCalled();
  });
});

describe('VerdictSummary', () => {
  const rule = {
    id: 'site-seen',
    zoneName: null,
    minPosts: 1,
    minPct: 70,
    text: 'At least 70 % of the site is seen by at least one post.',
    shortfallPct: 14,
    shortfallArea: 0,
    reasons: [],
  };
  const aCase = (actualPct: number) => ({
    key: `k${actualPct}`,
    targetName: 'Early smoke column',
    conditionSetName: 'Refraction spread',
    conditionLabel: 'standard optical (k 0.13)',
    check: {
      interpretation: 'v2',
      passed: actualPct >= 70,
      rules: [{ ...rule, actualPct, passed: actualPct >= 70 }],
      reasons: [],
    },
  });

  it('lists the failing rules with the share reached', () => {
    render(<VerdictSummary verdict={standardVerdict([aCase(56), aCase(80)])} />);
    expect(screen.getByText('Does not meet its coverage standard')).toBeTruthy();
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(1);
    expect(items[0]!.textContent).toContain('Reached 56 % of 70 %');
  });

  it('says so when the standard is met, and when nothing was checked', () => {
    const { rerender } = render(<VerdictSummary verdict={standardVerdict([aCase(80)])} />);
    expect(screen.getByText('Meets its coverage standard')).toBeTruthy();
    rerender(<VerdictSummary verdict={standardVerdict(null)} />);
    expect(screen.getByText('Standard not checked')).toBeTruthy();
  });
});
