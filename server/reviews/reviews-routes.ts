import { z } from 'zod';
import { userOf, type RouteTable } from '../http/routes';
import { budgetParams, commentParams, quantitySymbol, versionNumber } from '../http/params';
import { parse } from '../http/validate';
import type { ReviewsService } from './reviews-service';

const listQuery = z.strictObject({ version: versionNumber.optional() });
const newComment = z.strictObject({
  version: z.number({ error: 'must be a version number' }).int().positive(),
  symbol: quantitySymbol.nullable().optional(),
  parentId: z.number({ error: 'must be a comment id' }).int().positive({ message: 'must be a comment id' }).nullable().optional(),
  body: z.string({ error: 'must be text' }).trim().min(1, { message: 'must not be empty' }).max(10_000),
});
const patchComment = z.strictObject({ resolved: z.boolean({ error: 'must be true or false' }) });
const transition = z.strictObject({
  to: z.enum(['in_review', 'approved', 'draft'], { error: 'must be in_review, approved or draft' }),
  comment: z.string().max(10_000).optional(),
  password: z.string().max(1000).optional(),
  reason: z.string({ error: 'must be text' }).max(10_000).optional(),
});

export function reviewsRoutes(t: RouteTable, reviews: ReviewsService): void {
  t.add('get', '/api/budgets/:id/comments', 'budget.read', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const q = parse(listQuery, req.query);
    res.json(reviews.comments(id, q.version));
  });

  t.add('post', '/api/budgets/:id/comments', 'comment.create', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const b = parse(newComment, req.body);
    res.status(201).json(reviews.addComment(userOf(req), id, b));
  });

  t.add('patch', '/api/budgets/:id/comments/:cid', 'comment.resolve', (req, res) => {
    const p = parse(commentParams, req.params);
    const b = parse(patchComment, req.body);
    res.json(reviews.resolveComment(userOf(req), p.id, p.cid, b.resolved));
  });

  t.add('get', '/api/budgets/:id/review', 'budget.read', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    res.json(reviews.state(userOf(req), id));
  });

  t.add('get', '/api/reviews/queue', 'budget.approve', (req, res) => {
    res.json(reviews.queue(userOf(req)));
  });

  t.add('post', '/api/budgets/:id/transitions', 'budget.transition', async (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const b = parse(transition, req.body);
    res.json(await reviews.transition(userOf(req), id, b));
  });
}
