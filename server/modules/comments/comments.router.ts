/**
 * Comment routes, mounted at the API root (app.ts):
 *   GET    /captures/:captureId/comments   the capture's thread, oldest first (any member)
 *   POST   /captures/:captureId/comments   add a comment (owner, analyst)
 *   DELETE /comments/:id                   delete a comment (its author, or an owner)
 */
import { Router } from 'express';
import { CreateCommentRequest, type CommentResponse, type CommentsResponse } from '../../contracts/comments';
import { routeParam } from '../../lib/route-param';
import { currentAuth, requireUser } from '../../middleware/session';
import type { CommentsService } from './comments.service';

export function createCommentsRouter({ comments }: { comments: CommentsService }): Router {
  const router = Router();

  router.get('/captures/:captureId/comments', requireUser, async (req, res) => {
    res.json((await comments.list(currentAuth(res).user.id, routeParam(req, 'captureId'))) satisfies CommentsResponse);
  });

  router.post('/captures/:captureId/comments', requireUser, async (req, res) => {
    const comment = await comments.create(currentAuth(res).user.id, routeParam(req, 'captureId'), () =>
      CreateCommentRequest.parse(req.body ?? {}),
    );
    res.status(201).json({ comment } satisfies CommentResponse);
  });

  router.delete('/comments/:id', requireUser, async (req, res) => {
    await comments.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
