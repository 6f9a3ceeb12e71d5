import { PublicPage } from '@/components/ui/public-page';

/**
 * Where the payment service sends the buyer back after checkout. The buyer has no account:
 * this page only thanks them (or says nothing was charged); the keeper sees the payment in
 * Rackside once the service's signed webhook arrives, never from this page's address.
 */
export function PaymentDone({ result }: { result: string | null }) {
  const paid = result === 'paid';
  return (
    <PublicPage title={paid ? 'Thank you: payment received' : 'Payment not made'}>
      <p className="text-lg">
        {paid
          ? 'Your card payment went through. The breeder is told at once and will be in touch about shipping.'
          : 'You left the checkout before paying: nothing was charged. Use the payment link again when you are ready.'}
      </p>
      <p className="text-lg">You can close this page.</p>
    </PublicPage>
  );
}
