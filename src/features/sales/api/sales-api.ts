import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  BuyerBody,
  BuyerPatchBody,
  InvoiceBody,
  ReserveBody,
  SalePatchBody,
  SalesSettingsBody,
  ShippingBody,
} from '#shared/schemas/sales';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/sales');
const base = (collectionId: string) => `/collections/${collectionId}`;

/** The invoice PDF opens in the browser's own viewer (a GET with the session cookie). */
export const invoicePdfUrl = (collectionId: string, invoiceId: string) =>
  `/api${base(collectionId)}/invoices/${invoiceId}/invoice.pdf`;

export const useSalesSettings = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.sales.settings(collectionId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/sales-settings`, {
        schema: async () => (await schemas()).salesSettingsResponse,
      }),
  });

export const useBuyers = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.sales.buyers(collectionId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/buyers`, {
        schema: async () => (await schemas()).buyersResponse,
      }),
  });

export const useSales = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.sales.list(collectionId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/sales`, {
        schema: async () => (await schemas()).salesResponse,
      }),
  });

export const useAvailable = (collectionId: string, { enabled = true } = {}) =>
  useQuery({
    queryKey: queryKeys.sales.available(collectionId),
    enabled,
    queryFn: () =>
      apiRequest(`${base(collectionId)}/sales/available`, {
        schema: async () => (await schemas()).availableResponse,
      }),
  });

export const useSale = (collectionId: string, saleId: string) =>
  useQuery({
    queryKey: queryKeys.sales.sale(collectionId, saleId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/sales/${saleId}`, {
        schema: async () => (await schemas()).saleDetail,
      }),
  });

/** How a sold animal left: owners and keepers only (the route refuses helpers). */
export const useAnimalSale = (collectionId: string, animalId: string, { enabled = true } = {}) =>
  useQuery({
    queryKey: queryKeys.sales.animal(collectionId, animalId),
    enabled,
    queryFn: () =>
      apiRequest(`${base(collectionId)}/animals/${animalId}/sale`, {
        schema: async () => (await schemas()).animalSaleResponse,
      }),
  });

/** Every change refreshes the collection's sales queries (lists, counts, the sale itself). */
function useRefresh(collectionId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: queryKeys.sales.all(collectionId) });
}

export function useSalesSettingsChange(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: SalesSettingsBody) =>
      apiRequest(`${base(collectionId)}/sales-settings`, {
        method: 'PUT',
        body,
        schema: async () => (await schemas()).salesSettingsResponse,
      }),
    onSuccess: refresh,
  });
}

export function useBuyerChanges(collectionId: string) {
  const refresh = useRefresh(collectionId);
  const view = async () => (await schemas()).buyerView;
  return {
    create: useMutation({
      mutationFn: (body: BuyerBody) =>
        apiRequest(`${base(collectionId)}/buyers`, { method: 'POST', body, schema: view }),
      onSuccess: refresh,
    }),
    update: useMutation({
      mutationFn: ({ buyerId, body }: { buyerId: string; body: BuyerPatchBody }) =>
        apiRequest(`${base(collectionId)}/buyers/${buyerId}`, {
          method: 'PATCH',
          body,
          schema: view,
        }),
      onSuccess: refresh,
    }),
    remove: useMutation({
      mutationFn: (buyerId: string) =>
        apiRequest(`${base(collectionId)}/buyers/${buyerId}`, {
          method: 'DELETE',
          schema: async () => (await import('#shared/schemas/common')).noContent,
        }),
      onSuccess: refresh,
    }),
  };
}

export function useReserve(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: ReserveBody) =>
      apiRequest(`${base(collectionId)}/sales`, {
        method: 'POST',
        body,
        schema: async () => (await schemas()).saleDetail,
      }),
    onSuccess: refresh,
  });
}

/** The changes a sale's page makes: hold, cancel, invoice, shipping, the hand-over. */
export function useSaleChanges(collectionId: string, saleId: string) {
  const refresh = useRefresh(collectionId);
  const sale = `${base(collectionId)}/sales/${saleId}`;
  const detail = async () => (await schemas()).saleDetail;
  const invoice = async () => (await schemas()).invoiceView;
  return {
    patch: useMutation({
      mutationFn: (body: SalePatchBody) =>
        apiRequest(sale, { method: 'PATCH', body, schema: detail }),
      onSuccess: refresh,
    }),
    cancel: useMutation({
      mutationFn: () => apiRequest(`${sale}/cancel`, { method: 'POST', schema: detail }),
      onSuccess: refresh,
    }),
    invoice: useMutation({
      mutationFn: (body: InvoiceBody) =>
        apiRequest(`${sale}/invoice`, { method: 'POST', body, schema: invoice }),
      onSuccess: refresh,
    }),
    emailInvoice: useMutation({
      mutationFn: (invoiceId: string) =>
        apiRequest(`${base(collectionId)}/invoices/${invoiceId}/email`, {
          method: 'POST',
          schema: invoice,
        }),
      onSuccess: refresh,
    }),
    cancelInvoice: useMutation({
      mutationFn: (invoiceId: string) =>
        apiRequest(`${base(collectionId)}/invoices/${invoiceId}/cancel`, {
          method: 'POST',
          schema: invoice,
        }),
      onSuccess: refresh,
    }),
    shipping: useMutation({
      mutationFn: (body: ShippingBody) =>
        apiRequest(`${sale}/shipping`, { method: 'PUT', body, schema: detail }),
      onSuccess: refresh,
    }),
    confirm: useMutation({
      mutationFn: (shipAnyway: boolean) =>
        apiRequest(`${sale}/shipping/confirm`, {
          method: 'POST',
          body: { shipAnyway },
          schema: detail,
        }),
      onSuccess: refresh,
    }),
    ship: useMutation({
      mutationFn: () => apiRequest(`${sale}/ship`, { method: 'POST', schema: detail }),
      onSuccess: refresh,
    }),
  };
}
