import { rm } from "node:fs/promises";
import { Router, type NextFunction, type Request, type RequestHandler, type Response } from "express";
import type { z } from "zod";
import { AppError } from "./app-error.ts";
import { zodToAppError } from "./error-handler.ts";
import type { Policy, SignedInUser } from "./policy.ts";
import { noteWrite, readFromReplica, wroteRecently } from "../db/replica.ts";
import { appConfig } from "./app-locals.ts";
import { checkDeclaredAnswer } from "./response-check.ts";

type Schemas = { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType };
type Maybe = z.ZodType | undefined;
type Parsed<T> = T extends z.ZodType ? z.output<T> : Record<string, never>;
export type RouteInput<P extends Maybe, Q extends Maybe, B extends Maybe> = {
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
};

export interface RouteOptions<
  P extends Maybe,
  Q extends Maybe,
  B extends Maybe,
  R extends Maybe = undefined,
> {
  /** Who may call it: declared beside the route so a missing rule stands out. */
  allow: Policy;
  /** Middleware that must run before validation, e.g. the multer upload parser. */
  before?: RequestHandler[];
  params?: P;
  query?: Q;
  body?: B;
  /**
   * "replica": a read-only page that tolerates a little lag may be answered by the streaming replica, unless this
   * session wrote within READ_YOUR_WRITES_SECONDS. The handler must only read, and only through db().
   */
  reads?: "replica";
  /**
   * The JSON answer's shape, declared once in shared/ and parsed by the client with the same schema; the handler's
   * return type is checked against it, and a test parses every GET answer on the demo data with it.
   */
  response?: R;
  /** The status of a JSON answer when it is not 200: 201 for a record the call created. */
  status?: 201 | 202;
}

type Answer<R extends Maybe> = R extends z.ZodType ? z.input<R> : unknown;
type Handler<P extends Maybe, Q extends Maybe, B extends Maybe, R extends Maybe = undefined> = (
  req: Request & { user?: SignedInUser },
  res: Response,
  input: RouteInput<P, Q, B>,
) => Promise<Answer<R>> | Answer<R>;

export interface RouteEntry {
  method: "get" | "post" | "put" | "patch" | "delete";
  path: string;
  policy: Policy;
  schemas: Schemas;
  upload: boolean;
  /** The declared JSON answer, when the route answers JSON. */
  response?: z.ZodType;
}

/** Every route of the API, so tests can walk it and check each against its policy. */
export const routeTable: RouteEntry[] = [];

function authorize(policy: Policy, req: Request): SignedInUser | undefined {
  if (policy.roles === "anyone") return req.user;
  if (!req.user) throw new AppError("unauthenticated", "Sign in first");
  if (policy.roles !== "signed_in" && !policy.roles.includes(req.user.role)) {
    throw new AppError("forbidden", "Your role may not do this");
  }
  return req.user;
}

function parsePart(schema: z.ZodType | undefined, value: unknown, where: string): unknown {
  if (!schema) return {};
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw zodToAppError(result.error, where);
  return result.data;
}

export function createRoutes(prefix: string) {
  const router = Router();

  function add<P extends Maybe, Q extends Maybe, B extends Maybe, R extends Maybe>(
    method: RouteEntry["method"],
    path: string,
    options: RouteOptions<P, Q, B, R>,
    handler: Handler<P, Q, B, R>,
  ) {
    routeTable.push({
      method,
      path: prefix + path,
      policy: options.allow,
      schemas: { params: options.params, query: options.query, body: options.body },
      upload: Boolean(options.before?.length),
      response: options.response,
    });
    // Role, then ownership of the object named in the path, before any upload is parsed or any input read: a
    // foreign id answers exactly like a missing one, whatever the body says.
    const guard: RequestHandler = async (req, _res, next) => {
      const user = authorize(options.allow, req);
      if (options.allow.owns && user) {
        const params = parsePart(options.params, req.params, "params") as Record<string, unknown>;
        if (!(await options.allow.owns(user, params)))
          throw new AppError("not_found", "That record was not found");
      }
      noteWrite(req);
      next();
    };
    const run = async (req: Request, res: Response, next: NextFunction) => {
      const input = {
        params: parsePart(options.params, req.params, "params"),
        query: parsePart(options.query, req.query, "query"),
        body: parsePart(options.body, req.body, "body"),
      } as RouteInput<P, Q, B>;
      const onReplica =
        options.reads === "replica" && !wroteRecently(req, appConfig(req).READ_YOUR_WRITES_SECONDS);
      const result = onReplica
        ? await readFromReplica(async () => handler(req, res, input))
        : await handler(req, res, input);
      if (!res.headersSent) {
        if (result === undefined) res.status(204).end();
        else {
          if (appConfig(req).CHECK_RESPONSE_SHAPES)
            checkDeclaredAnswer(`${method.toUpperCase()} ${prefix + path}`, options.response, result);
          if (options.status) res.status(options.status);
          res.json(result);
        }
      }
      void next;
    };
    // A refused upload (a bad field, an unknown holder, any error) must not leave multer's temporary file behind: the
    // use case moves a file it keeps, so whatever is still at the temporary path after a failure is removed here.
    const runAndTidy = async (req: Request, res: Response, next: NextFunction) => {
      try {
        await run(req, res, next);
      } catch (err) {
        if (req.file?.path) await rm(req.file.path, { force: true });
        throw err;
      }
    };
    router[method](
      prefix + path,
      guard,
      ...(options.before ?? []),
      options.before?.length ? runAndTidy : run,
    );
  }

  return {
    router,
    get: <
      P extends Maybe = undefined,
      Q extends Maybe = undefined,
      B extends Maybe = undefined,
      R extends Maybe = undefined,
    >(
      path: string,
      o: RouteOptions<P, Q, B, R>,
      h: Handler<P, Q, B, R>,
    ) => add("get", path, o, h),
    post: <
      P extends Maybe = undefined,
      Q extends Maybe = undefined,
      B extends Maybe = undefined,
      R extends Maybe = undefined,
    >(
      path: string,
      o: RouteOptions<P, Q, B, R>,
      h: Handler<P, Q, B, R>,
    ) => add("post", path, o, h),
    put: <
      P extends Maybe = undefined,
      Q extends Maybe = undefined,
      B extends Maybe = undefined,
      R extends Maybe = undefined,
    >(
      path: string,
      o: RouteOptions<P, Q, B, R>,
      h: Handler<P, Q, B, R>,
    ) => add("put", path, o, h),
    patch: <
      P extends Maybe = undefined,
      Q extends Maybe = undefined,
      B extends Maybe = undefined,
      R extends Maybe = undefined,
    >(
      path: string,
      o: RouteOptions<P, Q, B, R>,
      h: Handler<P, Q, B, R>,
    ) => add("patch", path, o, h),
    delete: <
      P extends Maybe = undefined,
      Q extends Maybe = undefined,
      B extends Maybe = undefined,
      R extends Maybe = undefined,
    >(
      path: string,
      o: RouteOptions<P, Q, B, R>,
      h: Handler<P, Q, B, R>,
    ) => add("delete", path, o, h),
  };
}
