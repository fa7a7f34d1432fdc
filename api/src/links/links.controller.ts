import { Body, Controller, Delete, Get, HttpCode, HttpStatus, Param, Patch, Post, Query } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiBearerAuth,
  ApiBody,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiQuery,
  ApiTags,
  ApiUnprocessableEntityResponse,
} from '@nestjs/swagger';
import {
  CreateLinkRequestSchema,
  CreateRevisionRequestSchema,
  ErrorBodySchema,
  LinkDetailSchema,
  LinkListQuerySchema,
  LinkListResponseSchema,
  MAX_VARIANTS_PER_REVISION,
  PromoteVariantRequestSchema,
  ReturnRevisionRequestSchema,
  ReviewActionResponseSchema,
  ReviewCommentRequestSchema,
  ReviewListResponseSchema,
  RevisionConflictBodySchema,
  RevisionDiffQuerySchema,
  RevisionDiffResponseSchema,
  RevisionListResponseSchema,
  RevisionSchema,
  UpdateLinkRequestSchema,
  type LinkDetail,
  type LinkListResponse,
  type ReviewActionResponse,
  type ReviewListResponse,
  type Revision,
  type RevisionDiffResponse,
  type RevisionListResponse,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { RolesFor } from '../common/decorators/roles.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { ListIndexParamPipe } from '../common/pipes/list-index-param.pipe.js';
import { PositiveIntParamPipe } from '../common/pipes/positive-int-param.pipe.js';
import { uuidParam } from '../common/pipes/uuid-param.pipe.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { LinksService } from './links.service.js';
import { ReviewsService } from './reviews.service.js';

const revisionParam = () => new PositiveIntParamPipe('revision');
const variantIndexParam = () => new ListIndexParamPipe('index', MAX_VARIANTS_PER_REVISION - 1);

@ApiTags('links')
@ApiBearerAuth()
@Controller('links')
export class LinksController {
  constructor(
    private readonly links: LinksService,
    private readonly reviews: ReviewsService,
  ) {}

  @Get()
  @ApiQuery({ name: 'query', required: false, schema: openApiSchema(LinkListQuerySchema), style: 'form', explode: true })
  @ApiOkResponse({ schema: openApiSchema(LinkListResponseSchema, 'output') })
  list(@CurrentUser() caller: AuthUser, @Query(new ZodValidationPipe(LinkListQuerySchema)) query: z.output<typeof LinkListQuerySchema>): Promise<LinkListResponse> {
    return this.links.list(caller, query);
  }

  @Post()
  @RolesFor('link.create')
  @ApiBody({ schema: openApiSchema(CreateLinkRequestSchema) })
  @ApiCreatedResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  create(@CurrentUser() caller: AuthUser, @Body(new ZodValidationPipe(CreateLinkRequestSchema)) body: z.output<typeof CreateLinkRequestSchema>): Promise<LinkDetail> {
    return this.links.create(caller, body);
  }

  @Get(':id')
  @ApiOkResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  get(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<LinkDetail> {
    return this.links.get(caller, id);
  }

  @Patch(':id')
  @RolesFor('link.update')
  @ApiBody({ schema: openApiSchema(UpdateLinkRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  @ApiConflictResponse({
    description: 'the link is archived, or installed and its sites would change (archive it and create a new link); on a link in review or approved a change sends it back to draft',
  })
  update(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Body(new ZodValidationPipe(UpdateLinkRequestSchema)) body: z.output<typeof UpdateLinkRequestSchema>,
  ): Promise<LinkDetail> {
    return this.links.update(caller, id, body);
  }

  @Delete(':id')
  @RolesFor('link.delete')
  @HttpCode(HttpStatus.NO_CONTENT)
  @ApiNoContentResponse({ description: 'the draft, its revisions and its trail are deleted' })
  @ApiConflictResponse({ description: 'the link was approved once or is past draft: archive it instead' })
  remove(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<void> {
    return this.links.remove(caller, id);
  }

  @Post(':id/archive')
  @RolesFor('link.archive')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  @ApiConflictResponse({ description: 'the link is already archived' })
  archive(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<LinkDetail> {
    return this.links.setArchived(caller, id, true);
  }

  @Post(':id/unarchive')
  @RolesFor('link.archive')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  @ApiConflictResponse({ description: 'the link is not archived' })
  unarchive(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<LinkDetail> {
    return this.links.setArchived(caller, id, false);
  }

  @Get(':id/revisions')
  @ApiOkResponse({ schema: openApiSchema(RevisionListResponseSchema, 'output') })
  listRevisions(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<RevisionListResponse> {
    return this.links.listRevisions(caller, id);
  }

  @Post(':id/revisions')
  @RolesFor('link.revise')
  @ApiBody({ schema: openApiSchema(CreateRevisionRequestSchema) })
  @ApiCreatedResponse({ schema: openApiSchema(LinkDetailSchema, 'output') })
  @ApiBadRequestResponse({ description: 'a field is invalid; a variant\'s field is named by its index, e.g. variants.2.design.transmitter.wavelengthM', schema: openApiSchema(ErrorBodySchema, 'output') })
  @ApiConflictResponse({ description: 'baseRevision is not the latest', schema: openApiSchema(RevisionConflictBodySchema, 'output') })
  createRevision(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Body(new ZodValidationPipe(CreateRevisionRequestSchema)) body: z.output<typeof CreateRevisionRequestSchema>,
  ): Promise<LinkDetail> {
    return this.links.createRevision(caller, id, body);
  }

  @Get(':id/revisions/:revision')
  @ApiOkResponse({ schema: openApiSchema(RevisionSchema, 'output') })
  getRevision(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string, @Param('revision', revisionParam()) revision: number): Promise<Revision> {
    return this.links.getRevision(caller, id, revision);
  }

  @Post(':id/revisions/:revision/variants/:index/promote')
  @RolesFor('variant.promote')
  @ApiBody({ schema: openApiSchema(PromoteVariantRequestSchema), required: false })
  @ApiCreatedResponse({
    description: 'revision n+1: the variant\'s design, the other designs (the former one in the promoted variant\'s place) as its variants; the link is a draft again',
    schema: openApiSchema(LinkDetailSchema, 'output'),
  })
  @ApiNotFoundResponse({ description: 'no such link, revision or variant' })
  @ApiConflictResponse({ description: 'revision n is not the latest (the body holds the latest), or the link is archived', schema: openApiSchema(RevisionConflictBodySchema, 'output') })
  @ApiUnprocessableEntityResponse({ description: 'a stored design no longer passes the design checks, or a budget could not be computed; nothing was saved' })
  promoteVariant(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', revisionParam()) revision: number,
    @Param('index', variantIndexParam()) index: number,
    @Body(new ZodValidationPipe(PromoteVariantRequestSchema)) body: z.output<typeof PromoteVariantRequestSchema>,
  ): Promise<LinkDetail> {
    return this.links.promoteVariant(caller, id, revision, index, body);
  }

  @Get(':id/diff')
  @ApiQuery({ name: 'from', type: Number })
  @ApiQuery({ name: 'to', type: Number })
  @ApiOkResponse({ schema: openApiSchema(RevisionDiffResponseSchema, 'output') })
  diff(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Query(new ZodValidationPipe(RevisionDiffQuerySchema)) query: z.output<typeof RevisionDiffQuerySchema>,
  ): Promise<RevisionDiffResponse> {
    return this.links.diff(caller, id, query.from, query.to);
  }

  @Get(':id/reviews')
  @ApiOkResponse({ schema: openApiSchema(ReviewListResponseSchema, 'output') })
  listReviews(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<ReviewListResponse> {
    return this.reviews.list(caller, id);
  }

  @Post(':id/revisions/:revision/submit')
  @RolesFor('review.submit')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(ReviewCommentRequestSchema), required: false })
  @ApiOkResponse({ schema: openApiSchema(ReviewActionResponseSchema, 'output') })
  submit(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', revisionParam()) revision: number,
    @Body(new ZodValidationPipe(ReviewCommentRequestSchema)) body: z.output<typeof ReviewCommentRequestSchema>,
  ): Promise<ReviewActionResponse> {
    return this.reviews.act(caller, id, revision, 'submit', body.comment);
  }

  @Post(':id/revisions/:revision/approve')
  @RolesFor('review.approve')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(ReviewCommentRequestSchema), required: false })
  @ApiOkResponse({ schema: openApiSchema(ReviewActionResponseSchema, 'output') })
  approve(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', revisionParam()) revision: number,
    @Body(new ZodValidationPipe(ReviewCommentRequestSchema)) body: z.output<typeof ReviewCommentRequestSchema>,
  ): Promise<ReviewActionResponse> {
    return this.reviews.act(caller, id, revision, 'approve', body.comment);
  }

  @Post(':id/revisions/:revision/return')
  @RolesFor('review.return')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(ReturnRevisionRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(ReviewActionResponseSchema, 'output') })
  returnToDraft(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', revisionParam()) revision: number,
    @Body(new ZodValidationPipe(ReturnRevisionRequestSchema)) body: z.output<typeof ReturnRevisionRequestSchema>,
  ): Promise<ReviewActionResponse> {
    return this.reviews.act(caller, id, revision, 'return', body.comment);
  }

  @Post(':id/revisions/:revision/install')
  @RolesFor('review.install')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(ReviewCommentRequestSchema), required: false })
  @ApiOkResponse({ schema: openApiSchema(ReviewActionResponseSchema, 'output') })
  install(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', revisionParam()) revision: number,
    @Body(new ZodValidationPipe(ReviewCommentRequestSchema)) body: z.output<typeof ReviewCommentRequestSchema>,
  ): Promise<ReviewActionResponse> {
    return this.reviews.act(caller, id, revision, 'install', body.comment);
  }
}
