import { Outlet, useLocation } from 'react-router-dom';
import { Layout } from 'antd';
import { CautionNote } from '@/components/caution-note';
import { RegionBoundary } from '@/components/region-boundary';
import { TopBar } from './top-bar';

/** Top bar, the page, and the caution line under every signed-in screen. */
export function AppLayout() {
  const { pathname } = useLocation();
  return (
    <Layout style={{ minHeight: '100vh' }}>
      <Layout.Header style={{ position: 'sticky', top: 0, zIndex: 10 }}>
        <TopBar />
      </Layout.Header>
      <Layout.Content style={{ padding: '24px 24px 8px', width: '100%', maxWidth: 1280, margin: '0 auto' }}>
        <div>
          <RegionBoundary region="this page" resetKey={pathname}>
            <Outlet />
          </RegionBoundary>
        </div>
      </Layout.Content>
      <Layout.Footer style={{ textAlign: 'center' }}>
        <CautionNote />
      </Layout.Footer>
    </Layout>
  );
}
