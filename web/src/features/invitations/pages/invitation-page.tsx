import { useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button, Card, Result, Typography } from 'antd';
import { paths } from '@/app/paths';
import { PageLoading } from '@/components/page-loading';
import { RoleTag } from '@/components/role-tag';
import { formatDateTime } from '@/lib/format';
import { useInvitation } from '../api/get-invitation';
import { AcceptInvitationForm } from '../components/accept-invitation-form';
import { InvitationProblem } from '../components/invitation-problem';

export function InvitationPage() {
  const { token = '' } = useParams();
  const { data: invitation, error, isLoading } = useInvitation(token);
  const [accepted, setAccepted] = useState(false);
  const [goneError, setGoneError] = useState<unknown>(null);

  const card = (content: ReactNode) => <Card style={{ width: '100%', maxWidth: 460 }}>{content}</Card>;

  if (isLoading) return card(<PageLoading label="Opening your invitation…" />);
  if (goneError || error || !invitation) return card(<InvitationProblem error={goneError ?? error} />);

  if (accepted) {
    return card(
      <Result
        status="success"
        title="Password set — sign in"
        subTitle={`Your account ${invitation.email} is ready.`}
        extra={
          <Link to={paths.signIn.getHref({ email: invitation.email })}>
            <Button type="primary">Sign in</Button>
          </Link>
        }
      />,
    );
  }

  return card(
    <>
      <Typography.Title level={3} style={{ marginTop: 0 }}>
        You are invited
      </Typography.Title>
      <Typography.Paragraph>
        {invitation.projectName ? (
          <>
            You have been invited to the project <Typography.Text strong>{invitation.projectName}</Typography.Text>
            {invitation.role && (
              <>
                {' '}as <RoleTag role={invitation.role} />
              </>
            )}
          </>
        ) : (
          <>You have been invited to Sagline.</>
        )}
      </Typography.Paragraph>
      <Typography.Paragraph type="secondary" style={{ fontSize: 13 }}>
        Choose your name and a password to open your account. This link works until {formatDateTime(invitation.expiresAt)}.
      </Typography.Paragraph>
      <AcceptInvitationForm token={token} invitation={invitation} onAccepted={() => setAccepted(true)} onGone={setGoneError} />
    </>,
  );
}
