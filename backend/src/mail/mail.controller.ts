import { Controller, Get, Param, Post, Query } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { OutboxMessageDto } from '@amberline/common';
import { Roles } from '../core/decorators/roles.decorator';
import { OutboxQuery } from './dto/outbox.dto';
import { MailService } from './mail.service';

/** The outbox as the admin sees it: what is waiting, what went out (with the SMTP message id), what failed. */
@ApiTags('mail')
@ApiBearerAuth()
@Controller('mail/outbox')
export class MailController {
  constructor(private readonly mail: MailService) {}

  @Get()
  @Roles('mail.manage')
  list(@Query() q: OutboxQuery): Promise<OutboxMessageDto[]> {
    return this.mail.list(q.status, q.limit);
  }

  @Post(':id/retry')
  @Roles('mail.manage')
  retry(@Param('id', UuidParam) id: string): Promise<OutboxMessageDto> {
    return this.mail.retry(id, new Date());
  }
}
