import { InputError } from '@/lib/errors/input-error';

/** Invalid input to the anode list; one kind of InputError, so it maps to 422 with the field named. */
export class AnodeListInputError extends InputError {
  constructor(field: string, message: string) {
    super(field, message);
    this.name = 'AnodeListInputError';
  }
}
