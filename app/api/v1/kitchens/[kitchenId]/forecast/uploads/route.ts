import type { NextRequest } from 'next/server';
import { json, parseMultipart, route } from '@/lib/http/handler';
import { badRequest } from '@/lib/http/errors';
import { requireKitchen } from '@/lib/auth/guard';
import { createForecastUpload, fileTooLarge, UPLOAD_BODY_LIMIT_BYTES, UPLOAD_LIMIT_BYTES } from '@/lib/forecast/upload';
import { forecastUploadFieldsSchema } from '@/lib/validations/forecast';

type P = { kitchenId: string };

/** A kitchen lead uploads a CSV or EPW weather file for a day (multipart: file, date, mode); 5 MB at most. */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const form = await parseMultipart(req, UPLOAD_BODY_LIMIT_BYTES, fileTooLarge());
  const file = form.get('file');
  if (!(file instanceof File)) throw badRequest('Attach the weather file in the "file" field.', { file: 'Choose a CSV or EPW file.' });
  if (file.size > UPLOAD_LIMIT_BYTES) throw fileTooLarge();
  const fields = forecastUploadFieldsSchema.parse({ date: form.get('date') ?? undefined, mode: form.get('mode') ?? undefined });
  const created = await createForecastUpload(access.em, access.kitchen, access.user.id, { fileName: file.name, text: await file.text(), ...fields });
  return json(created, { status: 201 });
});
