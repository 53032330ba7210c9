import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { Card, Typography } from 'antd';
import { paths, safeReturnPath } from '@/app/paths';
import { useMe } from '../api/get-me';
import { SignInForm } from '../components/sign-in-form';

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeReturnPath(params.get('next')) ?? paths.projects.getHref();
  const { data: me, error } = useMe();

  // Already signed in (another tab, or a stale bookmark): go where they meant to.
  // Not on a cached answer the server has since refused (error), though.
  if (me && !error) return <Navigate to={next} replace />;

  return (
    <Card style={{ width: '100%', maxWidth: 400 }}>
      <Typography.Title level={3} style={{ marginTop: 0 }}>
        Sign in
      </Typography.Title>
      {params.get('next') && (
        <Typography.Paragraph type="secondary">Sign in to continue where you were.</Typography.Paragraph>
      )}
      <SignInForm
        initialEmail={params.get('email') ?? undefined}
        onSignedIn={() => navigate(next, { replace: true })}
      />
      <Typography.Paragraph type="secondary" style={{ marginTop: 16, marginBottom: 0, fontSize: 13 }}>
        No account yet? Accounts are opened by invitation: ask your project manager or administrator.
      </Typography.Paragraph>
    </Card>
  );
}
