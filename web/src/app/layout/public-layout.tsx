import { Link, Outlet, useLocation } from 'react-router-dom';
import { Flex, Layout } from 'antd';
import { CautionNote } from '@/components/caution-note';
import { RegionBoundary } from '@/components/region-boundary';
import { SaglineMark } from '@/components/sagline-mark';
import { paths } from '../paths';

/** Sign-in and invitation: the mark, one card, the caution line. */
export function PublicLayout() {
  const { pathname } = useLocation();
  return (
    <Layout style={{ minHeight: '100vh' }}>
      <Layout.Content>
        <Flex vertical align="center" gap={24} style={{ padding: '64px 16px 24px' }}>
          <Link to={paths.signIn.getHref()} style={{ display: 'flex', alignItems: 'center', gap: 12, color: '#1d2730' }}>
            <SaglineMark size={40} />
            <span style={{ fontSize: 26, fontWeight: 600, letterSpacing: 0.2 }}>Sagline</span>
          </Link>
          <div style={{ width: '100%', display: 'flex', justifyContent: 'center' }}>
            <RegionBoundary region="this page" resetKey={pathname}>
              <Outlet />
            </RegionBoundary>
          </div>
        </Flex>
      </Layout.Content>
      <Layout.Footer style={{ textAlign: 'center' }}>
        <CautionNote />
      </Layout.Footer>
    </Layout>
  );
}
