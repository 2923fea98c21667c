import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query, StreamableFile, UploadedFile, UseInterceptors } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type {
  AssignPermitsResponse, ExpiryScanResult, PaymentDto, PermitDocumentDto, PermitDto, PermitOverviewDto, PermitsPage, SessionUser, SyncPermitsResponse,
} from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { DocumentsService, MAX_PDF_BYTES, type UploadedPdf } from './documents.service';
import { AssignPermitsDto, ListPermitsQuery, PayPermitDto, RefundPermitDto, UpdatePermitDto } from './dto/permit.dto';
import { ExpiryScanService } from './expiry-scan.service';
import { PaymentsService } from './payments/payments.service';
import { PermitsService } from './permits.service';

@ApiTags('permits')
@ApiBearerAuth()
@Controller()
export class PermitsController {
  constructor(
    private readonly permits: PermitsService,
    private readonly documents: DocumentsService,
    private readonly payments: PaymentsService,
    private readonly scan: ExpiryScanService,
  ) {}

  @Get('permits')
  @Roles('permits.queue')
  list(@Query() q: ListPermitsQuery, @CurrentUser() user: SessionUser): Promise<PermitsPage> {
    return this.permits.list(q, user, new Date());
  }

  @Get('permits/overview')
  @Roles('permits.queue')
  overview(): Promise<PermitOverviewDto> {
    return this.permits.overview(new Date());
  }

  @Get('permits/assignees')
  @Roles('permits.queue')
  assignees(): Promise<{ id: string; name: string; role: string }[]> {
    return this.permits.assignees();
  }

  @Post('permits/assign')
  @HttpCode(200)
  @Roles('permits.work')
  assign(@Body() dto: AssignPermitsDto, @CurrentUser() user: SessionUser): Promise<AssignPermitsResponse> {
    return this.permits.assign(dto, user, new Date());
  }

  @Post('permits/expiry-scan')
  @HttpCode(200)
  @Roles('permits.work')
  expiryScan(): Promise<ExpiryScanResult> {
    return this.scan.scan(new Date());
  }

  @Get('permits/:id')
  @Roles('permits.read')
  get(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<PermitDto> {
    return this.permits.get(id, user, new Date());
  }

  @Patch('permits/:id')
  @Roles('permits.work')
  update(@Param('id', UuidParam) id: string, @Body() dto: UpdatePermitDto, @CurrentUser() user: SessionUser): Promise<PermitDto> {
    return this.permits.update(id, dto, user, new Date());
  }

  @Get('moves/:id/permits')
  @Roles('permits.read')
  forMove(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<PermitDto[]> {
    return this.permits.forMove(id, user, new Date());
  }

  @Post('moves/:id/permits/sync')
  @HttpCode(200)
  @Roles('permits.sync')
  sync(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<SyncPermitsResponse> {
    return this.permits.syncForMove(id, user, new Date());
  }

  @Post('permits/:id/documents')
  @Roles('permits.work')
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    description: "The state's permit as one PDF file",
    schema: { type: 'object', required: ['file'], properties: { file: { type: 'string', format: 'binary', description: `a PDF of at most ${MAX_PDF_BYTES} bytes` } } },
  })
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_PDF_BYTES, files: 1, fields: 5 } }))
  upload(@Param('id', UuidParam) id: string, @UploadedFile() file: UploadedPdf | undefined, @CurrentUser() user: SessionUser): Promise<PermitDocumentDto> {
    return this.documents.upload(id, file, user);
  }

  @Get('permits/:id/documents/:docId')
  @Roles('permits.read')
  async download(@Param('id', UuidParam) id: string, @Param('docId', UuidParam) docId: string, @CurrentUser() user: SessionUser): Promise<StreamableFile> {
    const f = await this.documents.open(id, docId, user);
    return new StreamableFile(f.stream, {
      type: f.contentType,
      length: f.size,
      disposition: `attachment; filename="${f.fileName}"; filename*=UTF-8''${encodeURIComponent(f.fileName)}`,
    });
  }

  @Post('permits/:id/payments')
  @Roles('permits.work')
  pay(@Param('id', UuidParam) id: string, @Body() dto: PayPermitDto, @CurrentUser() user: SessionUser): Promise<PaymentDto> {
    return this.payments.pay(id, dto, user, new Date());
  }

  @Post('permits/:id/refunds')
  @Roles('permits.work')
  refund(@Param('id', UuidParam) id: string, @Body() dto: RefundPermitDto, @CurrentUser() user: SessionUser): Promise<PaymentDto> {
    return this.payments.refund(id, dto, user, new Date());
  }
}
