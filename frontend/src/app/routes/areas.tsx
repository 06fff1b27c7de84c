import { ComingSoon } from '../../components/ui';

/** An honest placeholder for an area that is not built yet: never sample data. */
export function UnbuiltAreaRoute({ title, purpose }: { title: string; purpose: string }) {
  return <ComingSoon title={title} purpose={purpose} />;
}
