import { AmendBody, PlanApprovalBody, ReturnBody, SignBody, SubmitBody } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { EDITORS, READERS, studyId } from '../studies/studies.routes';
import { amendStudy, approvePlan } from './amend.service';
import { listSignatures, studyReport } from './report.service';
import { signStudy } from './sign.service';
import { returnStudy, submitStudy } from './signoff.service';

const DIRECTOR = ['director'] as const;

export function signoffRoutes(ctx: AppContext): RouteSpec[] {
  return [
    {
      method: 'post', path: '/studies/:id/submit', access: EDITORS,
      handler: async (req, res) => res.json(await submitStudy(ctx, req.user!, studyId(req.params), parseRequest(SubmitBody, req.body, 'body').note)),
    },
    {
      method: 'post', path: '/studies/:id/return', access: DIRECTOR,
      handler: async (req, res) => res.json(await returnStudy(ctx, req.user!, studyId(req.params), parseRequest(ReturnBody, req.body, 'body').comment)),
    },
    {
      method: 'post', path: '/studies/:id/sign', access: DIRECTOR,
      handler: async (req, res) => res.json(await signStudy(ctx, req.user!, studyId(req.params), parseRequest(SignBody, req.body, 'body'), req.ip ?? '')),
    },
    {
      method: 'post', path: '/studies/:id/plan-approval', access: DIRECTOR,
      handler: async (req, res) => res.json(await approvePlan(ctx, req.user!, studyId(req.params), parseRequest(PlanApprovalBody, req.body, 'body'), req.ip ?? '')),
    },
    {
      method: 'post', path: '/studies/:id/amend', access: EDITORS,
      handler: async (req, res) => res.status(201).json(await amendStudy(ctx, req.user!, studyId(req.params), parseRequest(AmendBody, req.body, 'body').reason)),
    },
    { method: 'get', path: '/studies/:id/signatures', access: READERS, handler: async (req, res) => res.json(await listSignatures(ctx.db, req.user!, studyId(req.params))) },
    {
      method: 'get', path: '/studies/:id/report.pdf', access: READERS,
      handler: async (req, res) => {
        const report = await studyReport(ctx.db, req.user!, studyId(req.params));
        res.setHeader('Content-Type', 'application/pdf');
        res.setHeader('Content-Disposition', `inline; filename="${report.fileName}"`);
        res.setHeader('X-Content-SHA256', report.sha256);
        res.setHeader('Cache-Control', 'no-store');
        res.end(report.bytes);
      },
    },
  ];
}
