import type { AppContext } from '../context'
import type { Analysis } from '../entities/analysis.entity'
import { Annotation } from '../entities/annotation.entity'
import type { Blade } from '../entities/blade.entity'
import { NotFoundError } from '../errors'
import type { AnnotationDto, CreateAnnotationBody } from '../../shared/schemas/analyses'
import { queueMail } from './outbox.service'

type Ctx = Pick<AppContext, 'db' | 'queue' | 'config'>

export interface Author {
  id: string
  name: string
}

function toDto(note: Annotation, replies: Annotation[]): AnnotationDto {
  return {
    id: note.id, analysisId: note.analysisId, authorName: note.authorName, alongMm: note.alongMm,
    photoPoint: note.photoX !== null && note.photoY !== null ? [note.photoX, note.photoY] : null,
    text: note.text, resolved: note.resolvedAt !== null, createdAt: note.createdAt.toISOString(),
    replies: replies
      .filter((r) => r.parentId === note.id)
      .map((r) => ({ id: r.id, authorName: r.authorName, text: r.text, createdAt: r.createdAt.toISOString() })),
  }
}

export async function listAnnotations(ctx: Pick<AppContext, 'db'>, analysisId: string): Promise<AnnotationDto[]> {
  const rows = await ctx.db.getRepository(Annotation).find({ where: { analysisId }, order: { createdAt: 'ASC' } })
  return rows.filter((r) => !r.parentId).map((note) => toDto(note, rows))
}

export async function findAnnotation(ctx: Pick<AppContext, 'db'>, id: string): Promise<Annotation> {
  const note = await ctx.db.getRepository(Annotation).findOneBy({ id })
  if (!note || note.parentId) throw new NotFoundError('That note')
  return note
}

/** The skater's account gets an e-mail when someone else writes on one of their analyses. */
async function tellSkater(ctx: Ctx, blade: Blade, analysisId: string, author: Author, text: string): Promise<void> {
  const [owner]: { id: string; email: string; name: string }[] = await ctx.db.query(
    `SELECT a.id, a.email, a.name FROM skater_profiles s JOIN accounts a ON a.id = s.owner_account_id WHERE s.id = $1`,
    [blade.skaterProfileId])
  if (!owner || owner.id === author.id) return
  const link = new URL(`/analyses/${analysisId}`, ctx.config.PUBLIC_URL).toString()
  const side = blade.side === 'left' ? 'left' : 'right'
  await queueMail(ctx, {
    to: owner.email,
    subject: `${author.name} left a note on your ${side} blade`,
    text: `Hello ${owner.name},\n\n${author.name} wrote on a measurement of your ${side} blade:\n\n` +
      `“${text}”\n\nSee the note on the photo and reply: ${link}\n\n— Rockerbook`,
  })
}

export async function createAnnotation(ctx: Ctx, analysis: Analysis, blade: Blade, body: CreateAnnotationBody, author: Author) {
  const note = await ctx.db.getRepository(Annotation).save({
    analysisId: analysis.id, parentId: null, authorId: author.id, authorName: author.name,
    alongMm: body.alongMm ?? null, photoX: body.photoPoint?.[0] ?? null, photoY: body.photoPoint?.[1] ?? null,
    text: body.text, resolvedAt: null,
  })
  await tellSkater(ctx, blade, analysis.id, author, body.text)
  return toDto(note, [])
}

export async function replyToAnnotation(ctx: Ctx, note: Annotation, blade: Blade, text: string, author: Author) {
  await ctx.db.getRepository(Annotation).save({
    analysisId: note.analysisId, parentId: note.id, authorId: author.id, authorName: author.name,
    alongMm: null, photoX: null, photoY: null, text, resolvedAt: null,
  })
  await tellSkater(ctx, blade, note.analysisId, author, text)
  return (await listAnnotations(ctx, note.analysisId)).find((n) => n.id === note.id)!
}

export async function setResolved(ctx: Pick<AppContext, 'db'>, note: Annotation, resolved: boolean) {
  await ctx.db.getRepository(Annotation).update({ id: note.id }, { resolvedAt: resolved ? new Date() : null })
  return (await listAnnotations(ctx, note.analysisId)).find((n) => n.id === note.id)!
}
