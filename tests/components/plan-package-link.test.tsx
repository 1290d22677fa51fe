import { fireEvent, render, screen } from '@testing-library/react';
import { PlanPackageLink } from '@/components/reports/plan-package-link';

const PLAN = '6b1f2c1e-1c1a-4d1e-9c1a-0a1b2c3d4e5f';

// The link is a real anchor on the web (react-native-web renders `href`), so the browser downloads the file.
const hrefOf = (name: string) => screen.getByRole('link', { name }).getAttribute('href');

describe('PlanPackageLink', () => {
  it('links a frozen revision’s package, on A4 until US Letter is chosen', () => {
    render(<PlanPackageLink planId={PLAN} revision={2} />);
    expect(hrefOf('Download plan package (PDF)')).toBe(`/api/v1/plans/${PLAN}/revisions/2/report.pdf?paper=a4&coords=ddm`);
    fireEvent.click(screen.getByRole('checkbox', { name: 'US Letter' }));
    expect(hrefOf('Download plan package (PDF)')).toBe(`/api/v1/plans/${PLAN}/revisions/2/report.pdf?paper=letter&coords=ddm`);
  });

  it('offers a draft preview while the plan can change, and nothing while the revision is unknown', () => {
    const { rerender } = render(<PlanPackageLink planId={PLAN} revision={null} />);
    expect(hrefOf('Download draft preview (PDF)')).toBe(`/api/v1/plans/${PLAN}/preview/report.pdf?paper=a4&coords=ddm`);
    rerender(<PlanPackageLink planId={PLAN} revision={undefined} />);
    expect(screen.queryByRole('link')).toBeNull();
  });
});
