import { ArchiveQuery, AuditQuery } from '@shared/schemas';
import type { AppContext } from '../context';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { READERS, studyId } from '../studies/studies.routes';
import { searchArchive } from './archive.service';
import { exportArchive, exportStudy } from './export.service';
import { labHistory, labPeople, studyHistory } from './history.service';
import { checkChains, checkIntegrity } from './integrity.service';
import { reproduceStudy } from './reproduce.service';

export const AUDITORS = ['director', 'quality'] as const;
const XLSX = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

export function auditRoutes(ctx: AppContext): RouteSpec[] {
  const send = (res: import('express').Response, name: string, bytes: Buffer) => {
    res.setHeader('Content-Type', XLSX);
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.end(bytes);
  };
  return [
    { method: 'get', path: '/studies/:id/history', access: READERS, handler: async (req, res) => res.json(await studyHistory(ctx.db, req.user!, studyId(req.params))) },
    { method: 'get', path: '/people', access: READERS, handler: async (req, res) => res.json(await labPeople(ctx.db, req.user!)) },
    { method: 'get', path: '/audit', access: AUDITORS, handler: async (req, res) => res.json(await labHistory(ctx.db, req.user!, parseRequest(AuditQuery, req.query, 'query'))) },
    { method: 'get', path: '/archive', access: AUDITORS, handler: async (req, res) => res.json(await searchArchive(ctx.db, req.user!, parseRequest(ArchiveQuery, req.query, 'query'))) },
    {
      method: 'get', path: '/archive/export.xlsx', access: AUDITORS,
      handler: async (req, res) => send(res, 'parallax-archive.xlsx', await exportArchive(ctx.db, req.user!, parseRequest(ArchiveQuery, req.query, 'query'))),
    },
    {
      method: 'get', path: '/studies/:id/export.xlsx', access: AUDITORS,
      handler: async (req, res) => send(res, `parallax-study-${studyId(req.params)}.xlsx`, await exportStudy(ctx.db, req.user!, studyId(req.params))),
    },
    // These three only read and re-compute; they record that the check was made, and change nothing.
    { method: 'post', path: '/studies/:id/integrity-check', access: AUDITORS, readOnly: true, handler: async (req, res) => res.json(await checkIntegrity(ctx.db, req.user!, studyId(req.params))) },
    { method: 'post', path: '/studies/:id/reproduce', access: AUDITORS, readOnly: true, handler: async (req, res) => res.json(await reproduceStudy(ctx.db, req.user!, studyId(req.params))) },
    { method: 'post', path: '/audit/chain-check', access: AUDITORS, readOnly: true, handler: async (req, res) => res.json(await checkChains(ctx.db, req.user!)) },
  ];
}
