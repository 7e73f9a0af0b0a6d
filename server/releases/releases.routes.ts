import * as z from 'zod';
import {
  ChangeType, CreateReleaseBody, DueQuery, IdParams, LinkStudyBody, ReleaseQuery, ReleaseSignBody, StartFromDueBody, UpdateDueBody, UpdateReleaseBody,
  UpdateTemplateBody, WaiverBody,
} from '@shared/schemas';
import { AUDITORS } from '../audit/audit.routes';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { EDITORS, READERS } from '../studies/studies.routes';
import { listDue, startFromDue, updateDue } from './due.service';
import { exportReleases, releaseHistory, searchReleases } from './release-search';
import { checkReleaseIntegrity, releasePdf, signRelease } from './release-sign.service';
import { createRelease, getRelease, linkStudy, unlinkStudy, updateRelease, waiveRequirement } from './releases.service';
import { listTemplates, saveTemplate } from './templates';

const DIRECTOR = ['director'] as const;
const EVERYONE = ['technologist', 'director', 'quality', 'admin'] as const;
const ADMIN = ['admin'] as const;
const id = (params: unknown) => parseRequest(IdParams, params, 'params').id;
const LinkParams = z.object({ id: z.coerce.number().int().positive(), studyId: z.coerce.number().int().positive() });
const TemplateParams = z.object({ changeType: ChangeType });

/** Releases, their templates and the re-verification they set due (roles as in the architecture's table). */
export function releasesRoutes(ctx: AppContext): RouteSpec[] {
  const body = <T>(schema: z.ZodType<T>, b: unknown) => parseRequest(schema, b, 'body');
  return [
    { method: 'get', path: '/releases', access: READERS, handler: async (req, res) => res.json(await searchReleases(ctx.db, req.user!, parseRequest(ReleaseQuery, req.query, 'query'))) },
    {
      method: 'get', path: '/releases/export.xlsx', access: AUDITORS,
      handler: async (req, res) => {
        const bytes = await exportReleases(ctx.db, req.user!, parseRequest(ReleaseQuery, req.query, 'query'));
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.setHeader('Content-Disposition', 'attachment; filename="parallax-releases.xlsx"');
        res.end(bytes);
      },
    },
    { method: 'post', path: '/releases', access: EDITORS, handler: async (req, res) => res.status(201).json(await createRelease(ctx.db, req.user!, body(CreateReleaseBody, req.body))) },
    { method: 'get', path: '/releases/:id', access: READERS, handler: async (req, res) => res.json(await getRelease(ctx.db, req.user!, id(req.params))) },
    { method: 'patch', path: '/releases/:id', access: EDITORS, handler: async (req, res) => res.json(await updateRelease(ctx.db, req.user!, id(req.params), body(UpdateReleaseBody, req.body))) },
    { method: 'post', path: '/releases/:id/studies', access: EDITORS, handler: async (req, res) => res.json(await linkStudy(ctx.db, req.user!, id(req.params), body(LinkStudyBody, req.body))) },
    {
      method: 'delete', path: '/releases/:id/studies/:studyId', access: EDITORS,
      handler: async (req, res) => {
        const p = parseRequest(LinkParams, req.params, 'params');
        res.json(await unlinkStudy(ctx.db, req.user!, p.id, p.studyId));
      },
    },
    { method: 'post', path: '/releases/:id/waivers', access: DIRECTOR, handler: async (req, res) => res.json(await waiveRequirement(ctx.db, req.user!, id(req.params), body(WaiverBody, req.body))) },
    { method: 'post', path: '/releases/:id/sign', access: DIRECTOR, handler: async (req, res) => res.json(await signRelease(ctx, req.user!, id(req.params), body(ReleaseSignBody, req.body), req.ip ?? '')) },
    {
      method: 'get', path: '/releases/:id/report.pdf', access: READERS,
      handler: async (req, res) => {
        const report = await releasePdf(ctx.db, req.user!, id(req.params));
        res.setHeader('Content-Type', 'application/pdf');
        res.setHeader('Content-Disposition', `inline; filename="${report.fileName}"`);
        res.setHeader('X-Content-SHA256', report.sha256);
        res.setHeader('Cache-Control', 'no-store');
        res.end(report.bytes);
      },
    },
    // Only reads and re-computes; records that the check was made, and changes nothing.
    { method: 'post', path: '/releases/:id/integrity-check', access: AUDITORS, readOnly: true, handler: async (req, res) => res.json(await checkReleaseIntegrity(ctx.db, req.user!, id(req.params))) },
    { method: 'get', path: '/releases/:id/history', access: READERS, handler: async (req, res) => res.json(await releaseHistory(ctx.db, req.user!, id(req.params))) },
    { method: 'get', path: '/release-templates', access: EVERYONE, handler: async (req, res) => res.json(await listTemplates(ctx.db, req.user!)) },
    {
      method: 'put', path: '/release-templates/:changeType', access: ADMIN,
      handler: async (req, res) => res.json(await saveTemplate(ctx.db, req.user!, parseRequest(TemplateParams, req.params, 'params').changeType, body(UpdateTemplateBody, req.body))),
    },
    { method: 'get', path: '/due', access: READERS, handler: async (req, res) => res.json(await listDue(ctx.db, req.user!, parseRequest(DueQuery, req.query, 'query'))) },
    { method: 'patch', path: '/due/:id', access: DIRECTOR, handler: async (req, res) => res.json(await updateDue(ctx.db, req.user!, id(req.params), body(UpdateDueBody, req.body))) },
    { method: 'post', path: '/due/:id/start', access: EDITORS, handler: async (req, res) => res.json(await startFromDue(ctx.db, req.user!, id(req.params), body(StartFromDueBody, req.body))) },
  ];
}
