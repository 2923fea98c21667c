import { Controller, Get, Headers, HttpCode, Post, Query, Req, Res, type RawBodyRequest } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiHeader, ApiTags } from '@nestjs/swagger';
import type { Request, Response } from 'express';
import type { PaymentsPage, SessionUser } from '@amberline/common';
import { CurrentUser } from '../../core/decorators/current-user.decorator';
import { Public } from '../../core/decorators/public.decorator';
import { Roles } from '../../core/decorators/roles.decorator';
import { ListPaymentsQuery } from '../dto/permit.dto';
import { PaymentsService } from './payments.service';

@ApiTags('payments')
@Controller('payments')
export class PaymentsController {
  constructor(private readonly payments: PaymentsService) {}

  /** The payment processor's events; no session, the signature is the proof. */
  @Post('webhook')
  @Public()
  @HttpCode(200)
  @ApiHeader({ name: 'stripe-signature', required: true, description: "the processor's signature of the raw body" })
  @ApiBody({ description: "A payment processor event as the processor sends it (checked against its signature, byte for byte)", schema: { type: 'object', required: ['id', 'type', 'data'], properties: { id: { type: 'string' }, type: { type: 'string' }, data: { type: 'object' } } } })
  webhook(@Req() req: RawBodyRequest<Request>, @Headers('stripe-signature') signature: string | undefined): Promise<{ received: true; handled: boolean }> {
    return this.payments.webhook(req.rawBody, signature, new Date());
  }

  @Get()
  @ApiBearerAuth()
  @Roles('payments.read')
  ledger(@Query() q: ListPaymentsQuery, @CurrentUser() user: SessionUser): Promise<PaymentsPage> {
    return this.payments.ledger(q, user);
  }

  @Get('export.csv')
  @ApiBearerAuth()
  @Roles('payments.read')
  async csv(@Query() q: ListPaymentsQuery, @Res({ passthrough: true }) res: Response): Promise<string> {
    const body = await this.payments.ledgerCsv(q);
    res.setHeader('content-type', 'text/csv; charset=utf-8');
    res.setHeader('content-disposition', `attachment; filename="payments-${new Date().toISOString().slice(0, 10)}.csv"`);
    return body;
  }
}
