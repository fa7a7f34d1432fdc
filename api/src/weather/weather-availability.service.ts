import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  analyseClimatologyAvailability,
  analyseRecordsAvailability,
  readStoredDesign,
  type LinkDesignInput,
  type RangeForAvailability,
} from '@beamwright/link-core';
import {
  CLIMATOLOGY_AVAILABILITY_METHOD,
  HOURS_PER_YEAR,
  RECORDS_AVAILABILITY_METHOD,
  type ClimatologyAvailabilityRequest,
  type ClimatologyAvailabilityResponse,
  type RevisionAvailability,
} from '@beamwright/link-core/contracts';
import type { AuthUser } from '../common/auth-user.js';
import { LinksService } from '../links/links.service.js';
import { WeatherDatasetsService } from './weather-datasets.service.js';

/** NaN (nothing usable) travels as null. */
const finiteOrNull = (value: number) => (Number.isFinite(value) ? value : null);

const toRanges = (ranges: RangeForAvailability[]) =>
  ranges.map((range) => ({ targetAvailability: range.targetAvailability, status: range.status, rangeM: range.rangeM, visibilityM: range.visibilityM }));

/**
 * The availability of a revision's design over a weather data set (METHODS.md §11): link-core's
 * analyseRecordsAvailability on the imported rows, whose totals are availabilityFromRecords itself;
 * or over a typed cumulative table. Both the revision and the data set are the caller's
 * organisation's (404 otherwise).
 */
@Injectable()
export class WeatherAvailabilityService {
  constructor(
    private readonly links: LinksService,
    private readonly datasets: WeatherDatasetsService,
  ) {}

  /** The revision's design, or one of its variants' (each read as the engine that stored it meant it). */
  private async designOf(caller: AuthUser, linkId: string, revision: number, variantIndex?: number): Promise<{ design: LinkDesignInput; variant: { index: number; name: string } | null }> {
    const stored = await this.links.getRevision(caller, linkId, revision);
    if (variantIndex === undefined) return { design: readStoredDesign(stored.design, stored.linkCoreVersion), variant: null };
    const variant = stored.variants?.find((candidate) => candidate.index === variantIndex);
    if (!variant) throw new NotFoundException(`revision ${revision} has no variant ${variantIndex}`);
    return { design: readStoredDesign(variant.design, variant.linkCoreVersion), variant: { index: variant.index, name: variant.name } };
  }

  async fromRecords(caller: AuthUser, linkId: string, revision: number, datasetId: string, requiredMarginDb: number, variantIndex?: number): Promise<RevisionAvailability> {
    const { design, variant } = await this.designOf(caller, linkId, revision, variantIndex);
    const { dataset, records } = await this.datasets.recordsOf(caller, datasetId);
    const analysis = analyseRecordsAvailability(
      design,
      { visibilityM: records.visibilityM, timestampsMs: records.timestampsMs, visibilityDefinition: dataset.visibilityDefinition },
      { requiredMarginDb },
    );
    const { totals } = analysis;
    return {
      linkId,
      revision,
      variant,
      datasetId,
      requiredMarginDb,
      visibilityDefinition: dataset.visibilityDefinition,
      availability: finiteOrNull(totals.availability),
      unavailableHours: totals.unavailableHours,
      coveredHours: totals.coveredHours,
      annualDowntimeH: finiteOrNull((1 - totals.availability) * HOURS_PER_YEAR),
      outageCount: totals.outageCount,
      longestOutageH: totals.longestOutageH,
      minimumVisibilityM: analysis.minimumVisibilityM,
      clearAirMarginDb: totals.clearAirMarginDb,
      worstMarginDb: finiteOrNull(totals.worstMarginDb),
      recordCount: totals.recordCount,
      usableCount: totals.usableCount,
      missingCount: totals.missingCount,
      months: analysis.months.map(({ month, availability, coveredHours, unavailableHours }) => ({ month, availability, coveredHours, unavailableHours })),
      longestOutages: analysis.outages.longest.map((outage) => ({
        startsAt: outage.startMs === null ? null : new Date(outage.startMs).toISOString(),
        durationH: outage.durationH,
        lowestVisibilityM: outage.lowestVisibilityM,
      })),
      marginDistribution: {
        binWidthDb: analysis.marginDistribution.binWidthDb,
        floorDb: analysis.marginDistribution.floorDb,
        belowHours: analysis.marginDistribution.belowHours,
        bins: analysis.marginDistribution.bins,
        exceeded: analysis.marginDistribution.exceeded.map((entry) => ({ share: entry.share, marginDb: finiteOrNull(entry.marginDb) })),
      },
      rangesForAvailability: analysis.rangesForAvailability && toRanges(analysis.rangesForAvailability),
      availabilityAgainstRange: analysis.availabilityAgainstRange && analysis.availabilityAgainstRange.map((point) => ({ rangeM: point.rangeM, availability: finiteOrNull(point.availability) })),
      method: RECORDS_AVAILABILITY_METHOD,
    };
  }

  async fromClimatology(
    caller: AuthUser,
    linkId: string,
    revision: number,
    request: Required<Pick<ClimatologyAvailabilityRequest, 'climatology'>> & { requiredMarginDb: number; variant?: number },
  ): Promise<ClimatologyAvailabilityResponse> {
    const { design, variant } = await this.designOf(caller, linkId, revision, request.variant);
    let analysis: ReturnType<typeof analyseClimatologyAvailability>;
    try {
      analysis = analyseClimatologyAvailability(design, request.climatology, { requiredMarginDb: request.requiredMarginDb });
    } catch (error) {
      // the schema has checked the table; what is left is the design's wavelength (below 550 nm)
      const message = error instanceof RangeError ? error.message : 'the availability cannot be computed for this design';
      const [path, reason] = message.includes(': ') ? [message.slice(0, message.indexOf(': ')), message.slice(message.indexOf(': ') + 2)] : ['', message];
      throw new BadRequestException({ message, issues: [{ path: `design.${path}`, message: reason }] });
    }
    const { totals } = analysis;
    return {
      linkId,
      revision,
      variant,
      requiredMarginDb: request.requiredMarginDb,
      availability: totals.availability,
      unavailability: totals.unavailability,
      annualDowntimeH: totals.outageHoursPerYear,
      minimumVisibilityM: totals.minimumVisibilityM,
      clearAirMarginDb: totals.clearAirMarginDb,
      maxSpecificAttenuationDbPerKm: totals.maxSpecificAttenuationDbPerKm,
      lookup: totals.lookup,
      rangesForAvailability: toRanges(analysis.rangesForAvailability),
      availabilityAgainstRange: analysis.availabilityAgainstRange,
      method: CLIMATOLOGY_AVAILABILITY_METHOD,
    };
  }
}
