import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { DataSource, Repository } from 'typeorm';
import type { SessionUser, TractorDto, TrailerDto } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { AppException, fieldError } from '../core/app-exception';
import { Tractor } from './entities/tractor.entity';
import { Trailer } from './entities/trailer.entity';
import { TractorInputDto, TrailerInputDto } from './dto/fleet.dto';

export const toTractorDto = (t: Tractor): TractorDto => ({
  id: t.id, unitNumber: t.unitNumber, plate: t.plate, ...t.spec, active: t.active, version: t.version, updatedAt: t.updatedAt.toISOString(),
});
export const toTrailerDto = (t: Trailer): TrailerDto => ({
  id: t.id, unitNumber: t.unitNumber, type: t.type, ...t.spec, active: t.active, version: t.version, updatedAt: t.updatedAt.toISOString(),
});

function checkTrailerGeometry(dto: TrailerInputDto): void {
  dto.decks.forEach((d, i) => {
    if (d.toFrontIn <= d.fromFrontIn) throw fieldError(`decks[${i}].toFrontIn`, 'must be behind fromFrontIn');
    if (d.toFrontIn > dto.lengthIn) throw fieldError(`decks[${i}].toFrontIn`, 'lies beyond the trailer length');
  });
  if (dto.slider) {
    if (dto.slider.maxFromKingpinFt < dto.slider.minFromKingpinFt) throw fieldError('slider.maxFromKingpinFt', 'must not be less than minFromKingpinFt');
    if (dto.axleGroupFromKingpinFt < dto.slider.minFromKingpinFt || dto.axleGroupFromKingpinFt > dto.slider.maxFromKingpinFt) {
      throw fieldError('axleGroupFromKingpinFt', 'must lie within the sliding range');
    }
  }
  const psis = dto.gaugeCalibration.map((p) => p.psi);
  if (new Set(psis).size !== psis.length) throw fieldError('gaugeCalibration', 'two readings at the same pressure');
}

/** Tractors and trailers. Admins write; dispatchers read. Every change is audited. */
@Injectable()
export class FleetService {
  constructor(
    private readonly ds: DataSource,
    private readonly audit: AuditService,
    @InjectRepository(Tractor) private readonly tractors: Repository<Tractor>,
    @InjectRepository(Trailer) private readonly trailers: Repository<Trailer>,
  ) {}

  async listTractors(): Promise<TractorDto[]> {
    return (await this.tractors.find({ order: { unitNumber: 'ASC' } })).map(toTractorDto);
  }
  async listTrailers(): Promise<TrailerDto[]> {
    return (await this.trailers.find({ order: { unitNumber: 'ASC' } })).map(toTrailerDto);
  }
  async tractor(id: string): Promise<Tractor> {
    const t = await this.tractors.findOneBy({ id });
    if (!t) throw new AppException(404, 'not_found', `No tractor ${id}`);
    return t;
  }
  async trailer(id: string): Promise<Trailer> {
    const t = await this.trailers.findOneBy({ id });
    if (!t) throw new AppException(404, 'not_found', `No trailer ${id}`);
    return t;
  }

  async saveTractor(dto: TractorInputDto, actor: SessionUser, id?: string, version?: number): Promise<TractorDto> {
    const { unitNumber, plate, ...spec } = dto;
    return this.ds.transaction(async (m) => {
      const before = id ? await m.findOne(Tractor, { where: { id }, lock: { mode: 'pessimistic_write' } }) : null;
      if (id && !before) throw new AppException(404, 'not_found', `No tractor ${id}`);
      if (before && version !== undefined && before.version !== version) throw new AppException(409, 'conflict', 'This tractor was changed by someone else; reload it');
      const dup = await m.findOneBy(Tractor, { unitNumber });
      if (dup && dup.id !== id) throw fieldError('unitNumber', 'already used by another tractor', 409);
      const saved = await m.save(Tractor, { ...(before ?? {}), unitNumber, plate, spec } as Tractor);
      await this.audit.record(m, { entity: 'tractor', entityId: saved.id, action: id ? 'updated' : 'created', actorId: actor.id, before: before ? toTractorDto(before) : null, after: toTractorDto(saved) });
      return toTractorDto(saved);
    });
  }

  async saveTrailer(dto: TrailerInputDto, actor: SessionUser, id?: string, version?: number): Promise<TrailerDto> {
    checkTrailerGeometry(dto);
    const { unitNumber, type, ...spec } = dto;
    return this.ds.transaction(async (m) => {
      const before = id ? await m.findOne(Trailer, { where: { id }, lock: { mode: 'pessimistic_write' } }) : null;
      if (id && !before) throw new AppException(404, 'not_found', `No trailer ${id}`);
      if (before && version !== undefined && before.version !== version) throw new AppException(409, 'conflict', 'This trailer was changed by someone else; reload it');
      const dup = await m.findOneBy(Trailer, { unitNumber });
      if (dup && dup.id !== id) throw fieldError('unitNumber', 'already used by another trailer', 409);
      const saved = await m.save(Trailer, { ...(before ?? {}), unitNumber, type, spec: JSON.parse(JSON.stringify(spec)) } as Trailer);
      await this.audit.record(m, { entity: 'trailer', entityId: saved.id, action: id ? 'updated' : 'created', actorId: actor.id, before: before ? toTrailerDto(before) : null, after: toTrailerDto(saved) });
      return toTrailerDto(saved);
    });
  }
}
