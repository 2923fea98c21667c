import { Controller, Get, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { DataSource } from 'typeorm';
import { Public } from '../core/decorators/public.decorator';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly ds: DataSource) {}

  /** Liveness without touching the database: also the floor route of the benchmark. */
  @Public()
  @Get('live')
  live(): { status: string } {
    return { status: 'ok' };
  }

  @Public()
  @Get()
  async health(@Res({ passthrough: true }) res: Response): Promise<{ status: string; db: string }> {
    let timer: NodeJS.Timeout | undefined;
    try {
      await Promise.race([this.ds.query('SELECT 1'), new Promise((_, rej) => (timer = setTimeout(() => rej(new Error('timeout')), 2000)))]);
      return { status: 'ok', db: 'up' };
    } catch {
      res.status(503);
      return { status: 'degraded', db: 'down' };
    } finally {
      clearTimeout(timer);
    }
  }
}
