import { Card, PageHeader } from '../../components/ui';
import { ApiTokensTable, CreateApiTokenForm } from '../../features/api-tokens';

export function ApiTokensRoute() {
  return (
    <div className="space-y-6">
      <PageHeader
        title="API tokens"
        description="A personal token lets a script use the API as you, with your role’s powers. Revoke it when the script no longer needs it."
      />
      <Card title="Create a token">
        <CreateApiTokenForm />
      </Card>
      <Card title="Your tokens">
        <ApiTokensTable />
      </Card>
    </div>
  );
}
