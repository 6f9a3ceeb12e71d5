import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InvoicePayments, ManualPaymentBody, RefundBody } from '#shared/schemas/payments';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/payments');

/** An invoice's money: status, payments and refunds, the last declined card, card on or off. */
export const useInvoicePayments = (collectionId: string, invoiceId: string) =>
  useQuery({
    queryKey: queryKeys.payments.invoice(collectionId, invoiceId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/invoices/${invoiceId}/payments`, {
        schema: async () => (await schemas()).invoicePayments,
      }),
    // A buyer may be paying right now on the checkout page: look again while the screen is open.
    refetchInterval: (query) =>
      query.state.data && ['open', 'part_paid'].includes(query.state.data.invoice.status)
        ? 15_000
        : false,
  });

/** Checkout, manual payment and refund; `onChanged` lets the page refresh its own invoice. */
export function usePaymentChanges(collectionId: string, invoiceId: string, onChanged?: () => void) {
  const queryClient = useQueryClient();
  const base = `/collections/${collectionId}/invoices/${invoiceId}`;
  const key = queryKeys.payments.invoice(collectionId, invoiceId);
  const settled = (answer: InvoicePayments) => {
    queryClient.setQueryData(key, answer);
    onChanged?.();
  };
  const answer = async () => (await schemas()).invoicePayments;
  return {
    checkout: useMutation({
      mutationFn: () =>
        apiRequest(`${base}/checkout`, {
          method: 'POST',
          schema: async () => (await schemas()).checkoutAnswer,
        }),
      onSuccess: () => queryClient.invalidateQueries({ queryKey: key }),
    }),
    record: useMutation({
      mutationFn: (body: ManualPaymentBody) =>
        apiRequest(`${base}/payments`, { method: 'POST', body, schema: answer }),
      onSuccess: settled,
    }),
    refund: useMutation({
      mutationFn: (body: RefundBody) =>
        apiRequest(`${base}/refund`, { method: 'POST', body, schema: answer }),
      onSuccess: settled,
    }),
  };
}
