import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { PageQuerySchema } from '@/shared/schemas/list';
import { PostInputSchema, PostListQuerySchema, PostUpdateSchema, SiteInputSchema, SiteUpdateSchema } from '@/shared/schemas/site';
import {
  createPost,
  createSite,
  deletePost,
  deleteSite,
  duplicatePost,
  getPost,
  getSite,
  listPosts,
  listSites,
  updatePost,
  updateSite,
} from '@/server/domain/sites/manage-sites';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const SiteParams = z.object({ siteId: z.uuid({ error: 'Not a site id.' }) });
const PostParams = SiteParams.extend({ postId: z.uuid({ error: 'Not a post id.' }) });

/** Sites and their posts. Every role reads; planners write. */
export function siteRoutes(db: Sequelize) {
  const router = Router();
  const write = [requireUser, requireRole('planner')];

  router.get('/sites', requireUser, async (req, res) => {
    const { page, pageSize } = parseOrThrow(PageQuerySchema, req.query, 'query');
    res.json(await listSites(actorOf(req), page, pageSize));
  });
  router.post('/sites', ...write, async (req, res) => {
    const input = parseOrThrow(SiteInputSchema, req.body, 'site');
    res.status(201).json({ site: await createSite({ db }, actorOf(req), input) });
  });
  router.get('/sites/:siteId', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json({ site: await getSite(actorOf(req), siteId) });
  });
  router.patch('/sites/:siteId', ...write, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const input = parseOrThrow(SiteUpdateSchema, req.body, 'site');
    res.json({ site: await updateSite({ db }, actorOf(req), siteId, input) });
  });
  router.delete('/sites/:siteId', ...write, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    await deleteSite({ db }, actorOf(req), siteId);
    res.status(204).end();
  });

  router.get('/sites/:siteId/posts', requireUser, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    res.json(await listPosts(actorOf(req), siteId, parseOrThrow(PostListQuerySchema, req.query, 'query')));
  });
  router.post('/sites/:siteId/posts', ...write, async (req, res) => {
    const { siteId } = parseOrThrow(SiteParams, req.params, 'address');
    const input = parseOrThrow(PostInputSchema, req.body, 'post');
    res.status(201).json({ post: await createPost({ db }, actorOf(req), siteId, input) });
  });
  router.get('/sites/:siteId/posts/:postId', requireUser, async (req, res) => {
    const { siteId, postId } = parseOrThrow(PostParams, req.params, 'address');
    res.json({ post: await getPost(actorOf(req), siteId, postId) });
  });
  router.patch('/sites/:siteId/posts/:postId', ...write, async (req, res) => {
    const { siteId, postId } = parseOrThrow(PostParams, req.params, 'address');
    const input = parseOrThrow(PostUpdateSchema, req.body, 'post');
    res.json({ post: await updatePost({ db }, actorOf(req), siteId, postId, input) });
  });
  router.post('/sites/:siteId/posts/:postId/duplicate', ...write, async (req, res) => {
    const { siteId, postId } = parseOrThrow(PostParams, req.params, 'address');
    res.status(201).json({ post: await duplicatePost({ db }, actorOf(req), siteId, postId) });
  });
  router.delete('/sites/:siteId/posts/:postId', ...write, async (req, res) => {
    const { siteId, postId } = parseOrThrow(PostParams, req.params, 'address');
    await deletePost({ db }, actorOf(req), siteId, postId);
    res.status(204).end();
  });
  return router;
}
