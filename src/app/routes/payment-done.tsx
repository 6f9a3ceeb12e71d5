import { useSearchParams } from 'react-router-dom';
import { PaymentDone } from '@/features/payments/components/payment-done';

/** Public: the buyer's page after card checkout (Sales — payments). */
export function PaymentDoneRoute() {
  const [params] = useSearchParams();
  return <PaymentDone result={params.get('result')} />;
}
