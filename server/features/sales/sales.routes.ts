import { Router, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import type { Role } from '#shared/domain/roles';
import { collectionParams } from '#shared/schemas/common';
import {
  animalSaleParams,
  buyerBody,
  buyerParams,
  buyerPatchBody,
  confirmShippingBody,
  invoiceBody,
  invoiceParams,
  reserveBody,
  saleParams,
  salePatchBody,
  salesSettingsBody,
  shippingBody,
} from '#shared/schemas/sales';
import { currentUserId } from '../../middleware/auth';
import { membershipOf } from '../../middleware/roles';
import { input, validate } from '../../middleware/validate';
import type { SalesService } from './sales.service';

/**
 * Sales under /collections/:collectionId (issue 21, part S). Owners and keepers only: helpers
 * never see prices, buyers or sales (403 from the membership check on every route here).
 *   /sales-settings, /buyers…, /sales…, /invoices/:invoiceId…, /animals/:animalId/sale
 */
export function salesRoutes(service: SalesService, member: (min: Role) => RequestHandler) {
  const router = Router({ mergeParams: true });
  const keeper = member('keeper');
  const body = <T>(res: Response) => input<T>(res, 'body');
  const param = (res: Response, name: string) =>
    input<Record<string, string>>(res, 'params')[name]!;
  const c = membershipOf;

  // ---- Settings
  router.get('/sales-settings', keeper, validate({ params: collectionParams }), async (_q, res) => {
    res.json(await service.settings(c(res)));
  });
  router.put(
    '/sales-settings',
    keeper,
    validate({ params: collectionParams, body: salesSettingsBody }),
    async (_q, res) => {
      res.json(await service.saveSettings(c(res), body(res)));
    },
  );

  // ---- Buyers
  router.get('/buyers', keeper, validate({ params: collectionParams }), async (_q, res) => {
    res.json(await service.buyers(c(res)));
  });
  router.post(
    '/buyers',
    keeper,
    validate({ params: collectionParams, body: buyerBody }),
    async (_q, res) => {
      res.status(201).json(await service.addBuyer(c(res), body(res)));
    },
  );
  router.get('/buyers/:buyerId', keeper, validate({ params: buyerParams }), async (_q, res) => {
    res.json(await service.buyer(c(res), param(res, 'buyerId')));
  });
  router.patch(
    '/buyers/:buyerId',
    keeper,
    validate({ params: buyerParams, body: buyerPatchBody }),
    async (_q, res) => {
      res.json(await service.editBuyer(c(res), param(res, 'buyerId'), body(res)));
    },
  );
  router.delete('/buyers/:buyerId', keeper, validate({ params: buyerParams }), async (_q, res) => {
    await service.removeBuyer(c(res), param(res, 'buyerId'));
    res.status(204).end();
  });

  // ---- Reservations and sales
  router.get('/sales', keeper, validate({ params: collectionParams }), async (_q, res) => {
    res.json(await service.list(c(res)));
  });
  router.get(
    '/sales/available',
    keeper,
    validate({ params: collectionParams }),
    async (_q, res) => {
      res.json(await service.available(c(res)));
    },
  );
  router.post(
    '/sales',
    keeper,
    validate({ params: collectionParams, body: reserveBody }),
    async (req, res) => {
      res
        .status(201)
        .json(
          await service.reserve(c(res), currentUserId(req), body<z.infer<typeof reserveBody>>(res)),
        );
    },
  );
  router.get('/sales/:saleId', keeper, validate({ params: saleParams }), async (_q, res) => {
    res.json(await service.detail(c(res), param(res, 'saleId')));
  });
  router.patch(
    '/sales/:saleId',
    keeper,
    validate({ params: saleParams, body: salePatchBody }),
    async (_q, res) => {
      res.json(await service.patch(c(res), param(res, 'saleId'), body(res)));
    },
  );
  router.post(
    '/sales/:saleId/cancel',
    keeper,
    validate({ params: saleParams }),
    async (_q, res) => {
      res.json(await service.cancel(c(res), param(res, 'saleId')));
    },
  );

  // ---- Invoices
  router.post(
    '/sales/:saleId/invoice',
    keeper,
    validate({ params: saleParams, body: invoiceBody }),
    async (req, res) => {
      res
        .status(201)
        .json(
          await service.createInvoice(
            c(res),
            currentUserId(req),
            param(res, 'saleId'),
            body<z.infer<typeof invoiceBody>>(res),
          ),
        );
    },
  );
  router.get(
    '/invoices/:invoiceId',
    keeper,
    validate({ params: invoiceParams }),
    async (_q, res) => {
      res.json(await service.invoice(c(res), param(res, 'invoiceId')));
    },
  );
  router.get(
    '/invoices/:invoiceId/invoice.pdf',
    keeper,
    validate({ params: invoiceParams }),
    async (_q, res) => {
      const { number, pdf } = await service.invoicePdf(c(res), param(res, 'invoiceId'));
      res
        .type('application/pdf')
        .set('Content-Disposition', `inline; filename="invoice-${number}.pdf"`)
        .set('Cache-Control', 'private, no-store')
        .send(pdf);
    },
  );
  router.post(
    '/invoices/:invoiceId/email',
    keeper,
    validate({ params: invoiceParams }),
    async (_q, res) => {
      res.json(await service.emailInvoice(c(res), param(res, 'invoiceId')));
    },
  );
  router.post(
    '/invoices/:invoiceId/cancel',
    keeper,
    validate({ params: invoiceParams }),
    async (_q, res) => {
      res.json(await service.cancelInvoice(c(res), param(res, 'invoiceId')));
    },
  );

  // ---- Shipping
  router.put(
    '/sales/:saleId/shipping',
    keeper,
    validate({ params: saleParams, body: shippingBody }),
    async (_q, res) => {
      res.json(await service.saveShipping(c(res), param(res, 'saleId'), body(res)));
    },
  );
  router.post(
    '/sales/:saleId/shipping/confirm',
    keeper,
    validate({ params: saleParams, body: confirmShippingBody }),
    async (req, res) => {
      res.json(
        await service.confirmShipping(
          c(res),
          currentUserId(req),
          param(res, 'saleId'),
          body<z.infer<typeof confirmShippingBody>>(res),
        ),
      );
    },
  );
  router.post('/sales/:saleId/ship', keeper, validate({ params: saleParams }), async (req, res) => {
    res.json(await service.ship(c(res), currentUserId(req), param(res, 'saleId')));
  });

  // ---- How an animal left (the animal page, owners and keepers only)
  router.get(
    '/animals/:animalId/sale',
    keeper,
    validate({ params: animalSaleParams }),
    async (_q, res) => {
      res.json(await service.animalSale(c(res), param(res, 'animalId')));
    },
  );
  return router;
}
