import multer from 'multer';
import * as z from 'zod';
import { ImportBody } from '@shared/schemas';
import type { AppContext } from '../context';
import { refuseControlCharacters } from '../http/control-characters';
import { parseRequest } from '../http/parse-request';
import type { RouteSpec } from '../http/routes';
import { EDITORS } from '../studies/studies.routes';
import { importUpload, receiveUpload } from './uploads.service';

export const UPLOAD_LIMIT_BYTES = 5 * 1024 * 1024;
const UploadParams = z.object({ id: z.coerce.number().int().positive(), uploadId: z.coerce.number().int().positive() });

export function uploadsRoutes(ctx: AppContext): RouteSpec[] {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: UPLOAD_LIMIT_BYTES, files: 1, fields: 5 } });
  return [
    {
      method: 'post', path: '/studies/:id/uploads', access: EDITORS, before: [upload.single('file')],
      handler: async (req, res) => {
        const { id } = parseRequest(UploadParams.pick({ id: true }), req.params, 'params');
        const file = req.file ? { ...req.file, originalname: Buffer.from(req.file.originalname, 'latin1').toString('utf8') } : undefined;
        refuseControlCharacters({ file: file?.originalname ?? '' });
        res.status(201).json(await receiveUpload(ctx.db, req.user!, id, file));
      },
    },
    {
      method: 'post', path: '/studies/:id/uploads/:uploadId/import', access: EDITORS,
      handler: async (req, res) => {
        const { id, uploadId } = parseRequest(UploadParams, req.params, 'params');
        res.json(await importUpload(ctx.db, req.user!, id, uploadId, parseRequest(ImportBody, req.body, 'body')));
      },
    },
  ];
}
