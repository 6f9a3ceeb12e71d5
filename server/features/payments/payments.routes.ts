import express, { Router, type RequestHandler } from 'express';
import type { Role } from '#shared/domain/roles';
import {
  invoiceParams,
  manualPaymentBody,
  refundBody,
  type ManualPaymentBody,
  type RefundBody,
} from '#shared/schemas/payments';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { PaymentsService } from './payments.service';

/**
 * Mounted on the collection:
 *   /invoices/:invoiceId/checkout, /invoices/:invoiceId/payments, /invoices/:invoiceId/refund
 * Owners and keepers only: helpers never see money (issue 21).
 */
export function paymentsRoutes(service: PaymentsService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const params = validate({ params: invoiceParams });
  const invoiceId = (res: Parameters<RequestHandler>[1]) =>
    input<{ invoiceId: string }>(res, 'params').invoiceId;

  router.post('/invoices/:invoiceId/checkout', member('keeper'), params, async (req, res) => {
    // Where the buyer comes back to when no PUBLIC_URL is set: this server as the keeper sees it.
    const origin = `${req.protocol}://${req.get('host')}`;
    res.json(await service.checkout(membershipOf(res).collectionId, invoiceId(res), origin));
  });
  router.get('/invoices/:invoiceId/payments', member('keeper'), params, async (_req, res) => {
    res.json(await service.list(membershipOf(res).collectionId, invoiceId(res)));
  });
  router.post(
    '/invoices/:invoiceId/payments',
    member('keeper'),
    validate({ params: invoiceParams, body: manualPaymentBody }),
    async (_req, res) => {
      const c = membershipOf(res).collectionId;
      await service.recordManual(c, invoiceId(res), input<ManualPaymentBody>(res, 'body'));
      res.status(201).json(await service.list(c, invoiceId(res)));
    },
  );
  router.post(
    '/invoices/:invoiceId/refund',
    member('keeper'),
    validate({ params: invoiceParams, body: refundBody }),
    async (_req, res) => {
      const c = membershipOf(res).collectionId;
      await service.refund(c, invoiceId(res), input<RefundBody>(res, 'body'));
      res.json(await service.list(c, invoiceId(res)));
    },
  );
  return router;
}

/**
 * Public POST /api/payments/webhook: mounted before the JSON parser, the sessions and the
 * same-site check — the service signs the raw bytes, has no session and sends no app header.
 */
export function paymentsWebhookRoutes(service: PaymentsService) {
  const router = Router();
  router.post('/', express.raw({ type: () => true, limit: '1mb' }), async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    res.json(await service.webhook(raw, req.get('stripe-signature')));
  });
  return router;
}
