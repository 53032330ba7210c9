import { Button, Result } from 'antd';
import { Link } from 'react-router-dom';
import { errorMessage, isApiError } from '@/app/api-error';
import { paths } from '@/app/paths';

/** A clear page for a link that cannot be used: expired, already used, or unknown. */
export function InvitationProblem({ error }: { error: unknown }) {
  const code = isApiError(error) ? error.code : undefined;
  if (code === 'INVITATION_EXPIRED') {
    return (
      <Result
        status="warning"
        title="This invitation has expired"
        subTitle="Invitation links are valid for a limited time. Ask the person who invited you to send a new one."
      />
    );
  }
  if (code === 'INVITATION_USED') {
    return (
      <Result
        status="info"
        title="This invitation has already been used"
        subTitle="The password for this account is set. Sign in with it, or ask your administrator if you have forgotten it."
        extra={
          <Link to={paths.signIn.getHref()}>
            <Button type="primary">Go to sign in</Button>
          </Link>
        }
      />
    );
  }
  if (code === 'INVITATION_INVALID' || code === 'NOT_FOUND') {
    return (
      <Result
        status="error"
        title="This invitation link is not valid"
        subTitle="Check that you opened the whole link from the e-mail. If it still does not work, ask for a new invitation."
      />
    );
  }
  return <Result status="error" title="The invitation could not be opened" subTitle={errorMessage(error)} />;
}
