import { Injectable } from '@nestjs/common';
import { DOMAIN_ERRORS, DomainError, type SessionUser, type TractorDto, type TrailerDto } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { Tractor } from './entities/tractor.entity';
import { Trailer } from './entities/trailer.entity';
import { TractorInputDto, TrailerInputDto } from './dto/fleet.dto';
import { FleetRepository, toTractorDto, toTrailerDto } from './fleet.repository';

export { toTractorDto, toTrailerDto };

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
    private readonly repo: FleetRepository,
    private readonly audit: AuditService,
  ) {}

  async listTractors(): Promise<TractorDto[]> {
    return (await this.repo.tractors()).map(toTractorDto);
  }
  async listTrailers(): Promise<TrailerDto[]> {
    return (await this.repo.trailers()).map(toTrailerDto);
  }
  async tractor(id: string): Promise<Tractor> {
    const t = await this.repo.tractor(id);
    if (!t) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No tractor ${id}`);
    return t;
  }
  async trailer(id: string): Promise<Trailer> {
    const t = await this.repo.trailer(id);
    if (!t) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No trailer ${id}`);
    return t;
  }

  async saveTractor(dto: TractorInputDto, actor: SessionUser, id?: string, version?: number): Promise<TractorDto> {
    const { unitNumber, plate, ...spec } = dto;
    return this.repo.transaction(async (m) => {
      const before = id ? await this.repo.lock(m, Tractor, id) : null;
      if (id && !before) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No tractor ${id}`);
      if (before && version !== undefined && before.version !== version) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'This tractor was changed by someone else; reload it');
      const dup = await this.repo.byUnitNumber(m, Tractor, unitNumber);
      if (dup && dup.id !== id) throw fieldError('unitNumber', 'already used by another tractor', 409);
      const saved = await this.repo.save(m, Tractor, { ...(before ?? {}), unitNumber, plate, spec } as Tractor);
      await this.audit.record(m, { entity: 'tractor', entityId: saved.id, action: id ? 'updated' : 'created', actorId: actor.id, before: before ? toTractorDto(before) : null, after: toTractorDto(saved) });
      return toTractorDto(saved);
    });
  }

  async saveTrailer(dto: TrailerInputDto, actor: SessionUser, id?: string, version?: number): Promise<TrailerDto> {
    checkTrailerGeometry(dto);
    const { unitNumber, type, ...spec } = dto;
    return this.repo.transaction(async (m) => {
      const before = id ? await this.repo.lock(m, Trailer, id) : null;
      if (id && !before) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No trailer ${id}`);
      if (before && version !== undefined && before.version !== version) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'This trailer was changed by someone else; reload it');
      const dup = await this.repo.byUnitNumber(m, Trailer, unitNumber);
      if (dup && dup.id !== id) throw fieldError('unitNumber', 'already used by another trailer', 409);
      const saved = await this.repo.save(m, Trailer, { ...(before ?? {}), unitNumber, type, spec: JSON.parse(JSON.stringify(spec)) } as Trailer);
      await this.audit.record(m, { entity: 'trailer', entityId: saved.id, action: id ? 'updated' : 'created', actorId: actor.id, before: before ? toTrailerDto(before) : null, after: toTrailerDto(saved) });
      return toTrailerDto(saved);
    });
  }
}
