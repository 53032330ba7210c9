import { render, screen } from '@testing-library/react';
import { palette } from '@/app/theme';
import { UtilisationBar } from './utilisation-bar';

describe('UtilisationBar', () => {
  it('draws a bar with the number beside it, and says over, near or within the limit', () => {
    render(
      <>
        <UtilisationBar value={1.24} />
        <UtilisationBar value={0.95} />
        <UtilisationBar value={0.4} />
      </>,
    );
    expect(screen.getAllByTestId('utilisation-bar')).toHaveLength(3);
    expect(screen.getByRole('img', { name: 'utilisation 1.24, over the limit' })).toHaveTextContent('1.24');
    expect(screen.getByRole('img', { name: 'utilisation 0.95, near the limit' })).toHaveTextContent('0.95');
    expect(screen.getByRole('img', { name: 'utilisation 0.40, within the limit' })).toHaveTextContent('0.40');
  });

  it('with bar={false} shows the same number, colour and words without the bar', () => {
    render(
      <>
        <UtilisationBar value={8.6} bar={false} />
        <UtilisationBar value={0.5} bar={false} />
      </>,
    );
    expect(screen.queryByTestId('utilisation-bar')).not.toBeInTheDocument();
    const over = screen.getByRole('img', { name: 'utilisation 8.60, over the limit' });
    expect(over).toHaveTextContent(/^8\.60$/);
    expect(screen.getByText('8.60')).toHaveStyle({ color: palette.fail });
    expect(screen.getByRole('img', { name: 'utilisation 0.50, within the limit' })).toHaveTextContent(/^0\.50$/);
    expect(screen.getByText('0.50')).not.toHaveStyle({ color: palette.fail });
  });

  it('shows a dash when no check applies, with or without the bar', () => {
    render(
      <>
        <UtilisationBar value={null} />
        <UtilisationBar value={null} bar={false} />
      </>,
    );
    expect(screen.getAllByLabelText('no check applies').map((e) => e.textContent)).toEqual(['—', '—']);
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
  });
});
