/**
 * The schemas that the first bundle's screens (sign-in, home, the session)
 * parse with. They reach those screens through `lazySchema`, from the deferred
 * chunk, so that zod is not part of the first load.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { MeResponseSchema, SignInRequestSchema } from '@/shared/schemas/auth';
import { PostListSchema, PostSchema, SiteListSchema, SiteSchema } from '@/shared/schemas/site';

export { MeResponseSchema, PostListSchema, SiteListSchema };
export const SiteBodySchema = z.object({ site: SiteSchema });
export const PostBodySchema = z.object({ post: PostSchema });
export const signInResolver = zodResolver(SignInRequestSchema);
