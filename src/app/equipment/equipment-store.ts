import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { ActionRequest } from '../batches/process/process-store';
import { messageOf } from '../core/api/message-of';
import type {
  CalibrationAnswer,
  CalibrationRequest,
  Equipment,
  EquipmentAddRequest,
  EquipmentChangeRequest,
  EquipmentList,
  EquipmentLog,
  EquipmentReadingAnswer,
  EquipmentReadingRequest,
} from './equipment-types';

/**
 * The kitchen's equipment over /api/equipment: the list (due soonest first), and readings,
 * ice-point checks and changes, each answered with the piece as it now stands.
 */
@Injectable({ providedIn: 'root' })
export class EquipmentStore {
  private readonly http = inject(HttpClient);
  private readonly list = signal<readonly Equipment[] | null>(null);
  private readonly busy = signal(false);
  private readonly failure = signal<string | null>(null);

  /** Pieces in use, the one due soonest first. */
  readonly active = computed(() => (this.list() ?? []).filter((e) => e.active));
  /** Retired pieces. */
  readonly retired = computed(() => (this.list() ?? []).filter((e) => !e.active));
  /** Whether the list has arrived. */
  readonly loaded = computed(() => this.list() !== null);
  /** Whether it is being read. */
  readonly loading = this.busy.asReadonly();
  /** Why it could not be read, or null. */
  readonly error = this.failure.asReadonly();

  /** Reads the list again; a failure is kept in `error`, never thrown. */
  async load(): Promise<void> {
    this.busy.set(true);
    this.failure.set(null);
    try {
      const answer = await firstValueFrom(this.http.get<EquipmentList>('/api/equipment'));
      this.list.set(answer.equipment);
    } catch (error) {
      this.failure.set(messageOf(error));
    } finally {
      this.busy.set(false);
    }
  }

  /** Records a reading; throws the API's error (a bad value, a retired unit). */
  async record(id: number, request: EquipmentReadingRequest): Promise<EquipmentReadingAnswer> {
    const answer = await firstValueFrom(
      this.http.post<EquipmentReadingAnswer>(`/api/equipment/${id}/readings`, request),
    );
    void this.load();
    return answer;
  }

  /** Records an ice-point check; throws the API's error ('ok' outside the tolerance). */
  async calibrate(id: number, request: CalibrationRequest): Promise<CalibrationAnswer> {
    const answer = await firstValueFrom(
      this.http.post<CalibrationAnswer>(`/api/equipment/${id}/calibrations`, request),
    );
    void this.load();
    return answer;
  }

  /** Records the corrective action that closes a deviation; throws the API's error. */
  async act(deviationId: number, action: ActionRequest): Promise<void> {
    await firstValueFrom(this.http.post(`/api/deviations/${deviationId}/action`, action));
    void this.load();
  }

  /** Adds a piece of equipment (admins). */
  async add(request: EquipmentAddRequest): Promise<Equipment> {
    const answer = await firstValueFrom(
      this.http.post<{ equipment: Equipment }>('/api/equipment', request),
    );
    void this.load();
    return answer.equipment;
  }

  /** Renames, changes the control of, retires or brings back a piece (admins). */
  async change(id: number, request: EquipmentChangeRequest): Promise<Equipment> {
    const answer = await firstValueFrom(
      this.http.patch<{ equipment: Equipment }>(`/api/equipment/${id}`, request),
    );
    void this.load();
    return answer.equipment;
  }

  /** A period's readings, deviations and checks; `from` and `to` are YYYY-MM-DD. */
  log(id: number, from: string, to: string): Promise<EquipmentLog> {
    return firstValueFrom(
      this.http.get<EquipmentLog>(`/api/equipment/${id}/log`, { params: { from, to } }),
    );
  }
}
