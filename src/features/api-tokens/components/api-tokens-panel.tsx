import { useState } from 'react';
import type { CreatedApiTokenResponse } from '../../../../server/contracts/api-tokens';
import { useApiTokens } from '../api/get-api-tokens';
import { ApiTokenList } from './api-token-list';
import { CreateApiTokenForm } from './create-api-token-form';
import { NewApiTokenSecret } from './new-api-token-secret';

/** The account page's tokens: make one (its secret shown once), see and revoke the others. */
export function ApiTokensPanel() {
  const tokens = useApiTokens();
  const [created, setCreated] = useState<CreatedApiTokenResponse | null>(null);
  return (
    <div className="grid gap-8">
      <CreateApiTokenForm onCreated={setCreated} />
      {created && <NewApiTokenSecret created={created} onDismiss={() => setCreated(null)} />}
      <ApiTokenList tokens={tokens} />
    </div>
  );
}
