/**
 * Read-only shares. Under /api/plans/:id/shares the owner lists, makes and revokes them (signed-in owner only;
 * anyone else gets the plan's 404 or 403). /api/links/:token/open lets a signed-in person holding a working link
 * add the plan to their "shared with me"; a revoked link answers 404 at once.
 */
import { Router } from 'express';
import type { Logger } from 'pino';
import { z } from 'zod';
import {
  LinkTokenParamsSchema,
  ShareCreateSchema,
  type LinkOpened,
  type PlanShareList,
  type ShareCreated,
} from '../../shared/schemas/plan-shares.schema';
import { currentUser, requireUser } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import { viewerOf, type PlansService } from './plans.service';
import type { SharesRepo } from './shares.repo';

const ShareParams = z.object({ id: z.string().min(1).max(64), shareId: z.string().min(1).max(64) });
const PlanParams = z.object({ id: z.string().min(1).max(64) });

export interface SharesRoutesDeps {
  service: PlansService;
  shares: SharesRepo;
  mailer: Mailer;
  logger: Logger;
  publicOrigin: string;
}

export function planSharesRoutes({
  service,
  shares,
  mailer,
  logger,
  publicOrigin,
}: SharesRoutesDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  router.get('/', async (req, res) => {
    const { id } = parseParams(PlanParams, req);
    await service.owned(id, currentUser(res));
    const body: PlanShareList = { items: await shares.listForPlan(id) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { id } = parseParams(PlanParams, req);
    const input = parseBody(ShareCreateSchema, req);
    const user = currentUser(res);
    const row = await service.owned(id, user);
    const name = (JSON.parse(row.document) as { name: string }).name;
    let url: string | null = null;
    let mailed = false;
    let shareId: string;
    if (input.kind === 'user') {
      const email = input.email.toLowerCase();
      if (email === viewerOf(user).email)
        throw new HttpError(400, 'VALIDATION_FAILED', 'This plan is already yours.', {
          email: ['Enter the address of someone else'],
        });
      const made = await shares.shareWithEmail(id, email);
      shareId = made.id;
      try {
        await mailer.send({
          to: email,
          subject: `${user.displayName} shared the plan “${name}” with you`,
          text: [
            `${user.displayName} shared the Leadbench plan “${name}” with you to view.`,
            '',
            `Open it here (sign in or create an account with this address): ${publicOrigin}/plans/${id}`,
            '',
            'You can operate it and sweep it on the Bench, and make your own copy to change.',
          ].join('\n'),
        });
        mailed = true;
      } catch (err) {
        logger.warn({ err }, 'share mail not sent');
      }
    } else {
      const link = await shares.createLink(id);
      shareId = link.id;
      url = `${publicOrigin}/shared/${link.token}`;
    }
    const share = (await shares.listForPlan(id)).find((s) => s.id === shareId)!;
    const body: ShareCreated = { share, url, mailed };
    res.status(201).json(body);
  });

  router.delete('/:shareId', async (req, res) => {
    const { id, shareId } = parseParams(ShareParams, req);
    await service.owned(id, currentUser(res));
    if (!(await shares.revoke(id, shareId))) throw notFound('That share');
    res.status(204).end();
  });

  return router;
}

export function linkRoutes({ service, shares }: Pick<SharesRoutesDeps, 'service' | 'shares'>): Router {
  const router = Router();
  router.use(requireUser);

  router.post('/:token/open', async (req, res) => {
    const { token } = parseParams(LinkTokenParamsSchema, req);
    const link = await shares.findLink(token);
    if (!link) throw notFound('That link');
    const user = currentUser(res);
    const viewer = viewerOf(user);
    const seen = await service.visible(link.planId, user).catch(() => null);
    if (seen?.access !== 'owner') {
      await shares.addVisitor(link.id, link.planId, viewer.email);
      // A plan in its owner's recently deleted list is not shown through a link either.
      await service.visible(link.planId, user);
    }
    const body: LinkOpened = { planId: link.planId };
    res.json(body);
  });

  return router;
}
