// TODO(issues 5 and 6): mentor profiles (GET /api/mentors/:id) and applications (POST /api/mentor-applications). Mounted at /api.
import { Router } from 'express';
import type { AppContext } from '../../context';

export function mentorsRouter(_ctx: AppContext): Router {
  return Router();
}
