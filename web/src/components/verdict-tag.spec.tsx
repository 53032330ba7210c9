import { render, screen } from '@testing-library/react';
import { palette } from '@/app/theme';
import { VerdictTag } from './verdict-tag';

describe('VerdictTag', () => {
  it('says Pass in green, Fail in red, and No check rather than passing a member without a check', () => {
    render(
      <>
        <VerdictTag verdict="pass" />
        <VerdictTag verdict="fail" />
        <VerdictTag verdict={null} />
      </>,
    );
    expect(screen.getByText('Pass')).toHaveStyle({ color: palette.pass });
    expect(screen.getByText('Fail')).toHaveStyle({ color: palette.fail });
    expect(screen.getByText('No check')).toBeInTheDocument();
  });
});
