import { createHash } from 'node:crypto';
import type { Attachment, Paged } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn, type PageQuery } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { UserRecord } from '../users/user.model';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { AttachmentRecord } from './attachment.model';
import { unsupportedType } from './upload';

export const ATTACHMENT_MAX_BYTES = 5 * 1024 * 1024;
const PDF_MAGIC = Buffer.from('%PDF-', 'ascii');

function toDto(a: AttachmentRecord): Attachment {
  return {
    id: a.id,
    ingredientId: a.ingredientId,
    filename: a.filename,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    sha256: a.sha256,
    uploadedBy: a.uploadedBy?.name ?? null,
    createdAt: a.createdAt.toISOString(),
  };
}

/** A file name safe to store and to send back: no path, no control characters, at most 200 characters. */
export function safeFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const cleaned = base.replace(/[\u0000-\u001f\u007f"]/g, '').trim().slice(0, 200);
  return cleaned || 'attachment.pdf';
}

/** Is this a PDF? Judged by its content (the `%PDF-` header), never by its name or declared type. */
export function isPdf(bytes: Buffer): boolean {
  return bytes.length >= PDF_MAGIC.length && bytes.subarray(0, PDF_MAGIC.length).equals(PDF_MAGIC);
}

async function ingredientOf(workspaceId: number, ingredientId: number) {
  const ingredient = await IngredientRecord.findOne({ where: { id: ingredientId, workspaceId } });
  if (!ingredient) throw AppError.notFound('Ingredient');
  return ingredient;
}

export async function addAttachment(actor: AuthUser, ingredientId: number, file: { originalname: string; buffer: Buffer }): Promise<Attachment> {
  await ingredientOf(actor.workspaceId, ingredientId);
  if (!isPdf(file.buffer)) throw unsupportedType('file', 'a PDF document (content starting with %PDF-)', `${file.originalname}, whose content is not a PDF`);
  const sha256 = createHash('sha256').update(file.buffer).digest('hex');
  return sequelize.transaction(async (transaction) => {
    const row = await AttachmentRecord.create(
      {
        workspaceId: actor.workspaceId,
        ingredientId,
        filename: safeFilename(file.originalname),
        contentType: 'application/pdf',
        sizeBytes: file.buffer.length,
        sha256,
        bytes: file.buffer,
        uploadedById: actor.id,
      },
      { transaction },
    );
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.attachment.add', entityType: 'ingredient', entityId: ingredientId, detail: { attachmentId: row.id, filename: row.filename, sizeBytes: row.sizeBytes, sha256 } },
      transaction,
    );
    row.uploadedBy = await UserRecord.findByPk(actor.id, { attributes: ['id', 'name'], transaction });
    return toDto(row);
  });
}

export async function listAttachments(workspaceId: number, ingredientId: number, query: PageQuery<'createdAt' | 'filename'>): Promise<Paged<Attachment>> {
  await ingredientOf(workspaceId, ingredientId);
  const { column, direction } = sortColumn(query.sort, { createdAt: 'createdAt', filename: 'filename' });
  const { rows, count } = await AttachmentRecord.findAndCountAll({
    where: { workspaceId, ingredientId },
    attributes: { exclude: ['bytes'] },
    include: [{ model: UserRecord, as: 'uploadedBy', attributes: ['id', 'name'] }],
    order: [[column, direction], ['id', direction]],
    ...pageWindow(query),
    distinct: true,
  });
  return pageOf(query, rows.map(toDto), count);
}

/** The stored file, for a member of the same workspace; another workspace's file answers 404. */
export async function attachmentForDownload(workspaceId: number, id: number) {
  const row = await AttachmentRecord.findOne({ where: { id, workspaceId } });
  if (!row) throw AppError.notFound('Attachment');
  return { filename: row.filename, contentType: row.contentType, bytes: row.bytes, sha256: row.sha256 };
}
