import { type CallHandler, type ExecutionContext, Injectable, type NestInterceptor } from '@nestjs/common';
import type { Request } from 'express';
import { Observable } from 'rxjs';
import { runInOrganisation } from '../db/organisation-context.js';
import type { AuthUser } from './auth.types.js';

/**
 * Runs each authenticated request's handler inside its caller's organisation: every transaction
 * it opens sets `app.org_id` from the verified access token, so PostgreSQL shows it that
 * organisation's rows only. Public routes run outside any organisation and see none.
 */
@Injectable()
export class OrganisationScopeInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (context.getType() !== 'http') return next.handle();
    const organisationId = context.switchToHttp().getRequest<Request & { user?: AuthUser }>().user?.organisationId;
    if (!organisationId) return next.handle();
    // next.handle() is lazy: the handler runs when subscribed, here inside the scope.
    return new Observable((subscriber) => runInOrganisation(organisationId, () => next.handle().subscribe(subscriber)));
  }
}
