import type { ReactNode } from 'react';
import { App as AntApp, ConfigProvider } from 'antd';
import enGB from 'antd/locale/en_GB';
import { SWRConfig, type SWRConfiguration } from 'swr';
import { isApiError } from './api-error';
import { theme } from './theme';

/**
 * Retry only what may pass on a second try: network failures and 5xx.
 * A 4xx is the same answer every time.
 */
const onErrorRetry: SWRConfiguration['onErrorRetry'] = (error, _key, _config, revalidate, { retryCount }) => {
  if (isApiError(error) && error.statusCode >= 400 && error.statusCode < 500) return;
  if (retryCount >= 3) return;
  setTimeout(() => void revalidate({ retryCount }), 1500 * 2 ** retryCount);
};

export function Providers({ children, swr }: { children: ReactNode; swr?: SWRConfiguration }) {
  return (
    <ConfigProvider theme={theme} locale={enGB}>
      <AntApp>
        <SWRConfig value={{ onErrorRetry, ...swr }}>{children}</SWRConfig>
      </AntApp>
    </ConfigProvider>
  );
}
