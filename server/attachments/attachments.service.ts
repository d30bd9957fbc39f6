/**
 * Source pages of a revision: the flight-manual extracts its figures came from, so that the
 * approver can compare. Added while the revision is a draft or in review, removed only while
 * it is a draft; once published they stay, like the revision.
 */
import { createHash, randomBytes } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { basename, join, resolve } from 'node:path';
import type { Transaction } from 'sequelize';
import type { AttachmentView } from '@shared/api/attachments';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError, notFound } from '../errors/domain-error';
import { Attachment, Revision, User } from '../models';
import { recordContribution } from '../revisions/revision-contributors';
import { OPEN_STATUSES, visibleRevision, type Viewer } from '../revisions/revision-access';
import { detectAttachmentType } from './file-type';
import { withoutForbiddenCharacters } from '@shared/text/plain-text';
import { transact } from '../transactions';

export const ATTACHMENT_MAX_BYTES = 10 * 1024 * 1024;
export const ATTACHMENTS_PER_REVISION = 20;

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

const REVISION = 'That revision';
const ATTACHMENT = 'That attachment';

export class AttachmentStore {
  /** `log` hears of a file a removal left behind (harmless, but worth a line). */
  constructor(
    private readonly rootDir: string,
    private readonly log?: { warn(details: object, message: string): void },
  ) {}

  pathOf(attachment: Pick<Attachment, 'operatorId' | 'storageName'>): string {
    return join(resolve(this.rootDir), String(attachment.operatorId), attachment.storageName);
  }

  async add(actor: Actor, revisionId: number, file: UploadedFile): Promise<AttachmentView> {
    const contentType = detectAttachmentType(file.buffer);
    if (!contentType) {
      throw new DomainError('unsupported-type', 'unsupported_file_type', 'Attach a PDF, PNG or JPEG file. This file is none of those, whatever its name says.', {
        file: 'Not a PDF, PNG or JPEG file.',
      });
    }
    // Checked before writing anything, and again under the lock below.
    await this.openRevision(actor.operatorId, revisionId);

    const storageName = randomBytes(16).toString('hex');
    const path = join(resolve(this.rootDir), String(actor.operatorId), storageName);
    await mkdir(join(resolve(this.rootDir), String(actor.operatorId)), { recursive: true });
    await writeFile(path, file.buffer, { flag: 'wx', mode: 0o640 });
    try {
      const attachment = await transact(async (transaction) => {
        const revision = await this.openRevision(actor.operatorId, revisionId, transaction);
        if ((await Attachment.count({ where: { revisionId }, transaction })) >= ATTACHMENTS_PER_REVISION) {
          throw new DomainError('conflict', 'too_many_attachments', `A revision holds at most ${ATTACHMENTS_PER_REVISION} source pages. Remove one first.`);
        }
        const created = await Attachment.create(
          {
            operatorId: actor.operatorId,
            revisionId,
            originalName: cleanName(file.originalname),
            contentType,
            sizeBytes: file.buffer.length,
            sha256: createHash('sha256').update(file.buffer).digest('hex'),
            storageName,
            uploadedById: actor.userId,
          },
          { transaction },
        );
        await recordContribution(actor, revision.id, 'attachments', transaction);
        await audit(actor, 'attachment.added', created, revision, transaction);
        return created;
      });
      return this.view(attachment);
    } catch (error) {
      await rm(path, { force: true });
      throw error;
    }
  }

  async list(viewer: Viewer, revisionId: number): Promise<AttachmentView[]> {
    await visibleRevision(viewer, revisionId);
    const attachments = await Attachment.findAll({ where: { revisionId, operatorId: viewer.operatorId }, order: [['id', 'ASC']] });
    return Promise.all(attachments.map((attachment) => this.view(attachment)));
  }

  /** The record of a file the viewer may open; 404 for another operator's or a hidden revision's. */
  async find(viewer: Viewer, id: number): Promise<Attachment> {
    const attachment = await Attachment.findOne({ where: { id, operatorId: viewer.operatorId } });
    if (!attachment) throw notFound(ATTACHMENT);
    try {
      await visibleRevision(viewer, attachment.revisionId);
    } catch {
      throw notFound(ATTACHMENT);
    }
    return attachment;
  }

  async remove(actor: Actor, id: number): Promise<void> {
    const attachment = await transact(async (transaction) => {
      const found = await Attachment.findOne({ where: { id, operatorId: actor.operatorId }, transaction, lock: transaction.LOCK.UPDATE });
      if (!found) throw notFound(ATTACHMENT);
      const revision = await Revision.findOne({ where: { id: found.revisionId, operatorId: actor.operatorId }, transaction, lock: transaction.LOCK.UPDATE });
      if (!revision) throw notFound(ATTACHMENT);
      if (revision.status !== 'draft') {
        throw new DomainError('conflict', 'wrong_status', `Source pages can be removed only while the revision is a draft; revision ${revision.number} is ${words(revision.status)}.`);
      }
      await found.destroy({ transaction });
      await recordContribution(actor, revision.id, 'attachments', transaction);
      await audit(actor, 'attachment.removed', found, revision, transaction);
      return found;
    });
    await this.removeFiles([attachment]);
  }

  /** The files of attachments whose rows are gone; a file left behind by a failed removal is harmless and logged. */
  async removeFiles(attachments: Pick<Attachment, 'operatorId' | 'storageName'>[]): Promise<void> {
    for (const attachment of attachments) {
      await rm(this.pathOf(attachment), { force: true }).catch((error: unknown) => this.log?.warn({ err: error }, 'attachment file not removed'));
    }
  }

  private async openRevision(operatorId: number, revisionId: number, transaction?: Transaction): Promise<Revision> {
    const revision = await Revision.findOne({
      where: { id: revisionId, operatorId },
      ...(transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {}),
    });
    if (!revision) throw notFound(REVISION);
    if (!OPEN_STATUSES.includes(revision.status)) {
      throw new DomainError('conflict', 'wrong_status', `Source pages can be added only while the revision is a draft or in review; revision ${revision.number} is ${words(revision.status)}.`);
    }
    return revision;
  }

  private async view(attachment: Attachment): Promise<AttachmentView> {
    const uploader = attachment.uploadedById ? await User.findByPk(attachment.uploadedById, { attributes: ['id', 'displayName'] }) : null;
    return {
      id: attachment.id,
      revisionId: attachment.revisionId,
      originalName: attachment.originalName,
      contentType: attachment.contentType as AttachmentView['contentType'],
      sizeBytes: attachment.sizeBytes,
      sha256: attachment.sha256,
      uploadedBy: uploader ? { id: uploader.id, displayName: uploader.displayName } : null,
      createdAt: attachment.createdAt.toISOString(),
      url: `/api/attachments/${attachment.id}`,
    };
  }
}

function audit(actor: Actor, action: string, attachment: Attachment, revision: Revision, transaction: Transaction) {
  return recordAudit(
    {
      operatorId: actor.operatorId,
      actorId: actor.userId,
      action,
      entityType: 'attachment',
      entityId: attachment.id,
      details: { revisionId: revision.id, revisionNumber: revision.number, originalName: attachment.originalName, sha256: attachment.sha256, sizeBytes: attachment.sizeBytes },
      origin: actor.origin,
    },
    transaction,
  );
}

/** The name as shown: no folders, no control characters, at most 200 characters. */
function cleanName(name: string): string {
  const cleaned = withoutForbiddenCharacters(basename(name.replace(/\\/g, '/'))).replace(/"/g, '').trim().slice(0, 200);
  return cleaned || 'source-page';
}

function words(status: string): string {
  return status.replace('_', ' ');
}
