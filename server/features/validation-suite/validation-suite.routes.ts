import { Router } from 'express';
import { validationSuiteRunView } from '../../../shared/contracts/validation-suite';
import { validationSuiteQuery } from '../../../shared/schemas/validation-suite';
import { requirePolicy } from '../../common/auth-middleware';
import { sendView } from '../../common/respond';
import { validQuery } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { validationSuite } from './validation-suite.service';

/** The validation suite: every fast reference check of the unit tests, run by this server's code (admins only). */
export function validationSuiteRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/admin/validation-suite', requirePolicy('validation:read'), async (req, res) => {
    const q = validQuery(validationSuiteQuery, req);
    sendView(res, validationSuiteRunView, await validationSuite(ctx.codeVersion, { rerun: q.rerun === '1' }));
  });
  return router;
}
