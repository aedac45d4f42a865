import { useEffect, useMemo, useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import type { ScenarioEvent } from '@/simulation/scenario';
import { findSpecies } from '@/simulation/catalogue';
import { AppText } from '@/components/ui/text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { SpeciesPicker } from '@/components/tanks/species-picker';
import { EVENT_KINDS, num } from '@/components/plans/event-kinds';
import { doseFormCautions } from '@/components/plans/dose-cautions';
import { EVENT_TYPES, FIELDS, blankFields, eventToFields, fieldsToEvent, type EventFields, type EventType } from '@/components/plans/event-fields';
import { addGroup, canAddGroup, groupCount, groupKey, removeGroup, removeGroupErrors, type GroupShape } from '@/components/plans/fish-groups';
import { eventStocking, type StockingContext } from '@/components/plans/event-stocking';

export type { StockingContext } from '@/components/plans/event-stocking';

export interface EventFormProps {
  /** The event being edited, or null for a new one. */
  editing: ScenarioEvent | null;
  onSubmit(event: ScenarioEvent): void;
  onCancel?(): void;
  /** Help under the day field when "the plan start" is not the right words (a lesson's day 0). */
  dayHint?: string;
  /** The tank's size and fish, for the crowding warning on fish going in. */
  stocking?: StockingContext;
  /** Catalogue ids the species picker lists first (the tank's own fish). */
  preferredSpecies?: readonly string[];
  /** Messages for the edited event's fields from elsewhere (a refused save), by form field. */
  initialErrors?: Record<string, string>;
  /** Fish in the tank on a day (for the dose form's caution); absent: not known. */
  fishOnDay?(day: number): number;
}

/** Add or edit one event: pick its kind, fill in a few numbers; errors appear under each field. */
export function EventForm({ editing, onSubmit, onCancel, dayHint, stocking, preferredSpecies, initialErrors, fishOnDay }: EventFormProps) {
  const { space, colors, radii, layout } = useTheme();
  const [type, setType] = useState<EventType>(editing?.type ?? 'add-fish');
  const [fields, setFields] = useState<EventFields>(editing ? eventToFields(editing) : blankFields('add-fish'));
  const [errors, setErrors] = useState<Record<string, string>>(initialErrors ?? {});

  useEffect(() => {
    setType(editing?.type ?? 'add-fish');
    setFields(editing ? eventToFields(editing) : blankFields('add-fish'));
  }, [editing]);
  // Messages from a refused save or forecast land on the opened event's fields; typing stays.
  useEffect(() => setErrors(initialErrors ?? {}), [editing, initialErrors]);

  const groups = EVENT_KINDS[type].groups;
  const chooseType = (t: EventType) => {
    setType(t);
    // The fish typed so far stay when switching between fish kinds.
    const keep = EVENT_KINDS[t].groups ? Object.fromEntries(Object.entries(fields).filter(([k]) => k.startsWith('fish.'))) : {};
    setFields((f) => ({ ...blankFields(t, Number(f.day) || 0), ...keep }));
    setErrors({});
  };
  const submit = () => {
    const result = fieldsToEvent(type, fields);
    if ('errors' in result) return setErrors(result.errors);
    setErrors({});
    onSubmit(result.event);
    if (!editing) setFields(blankFields(type, Number(fields.day) || 0));
  };
  const set = (key: string, v: string) => setFields((f) => ({ ...f, [key]: v }));
  const clearError = (...keys: string[]) => setErrors((e) => Object.fromEntries(Object.entries(e).filter(([k]) => !keys.includes(k))));

  const doseDay = num(fields.day) ?? 0;
  const cautions = type === 'ammonia-dose' ? doseFormCautions(fishOnDay ? fishOnDay(Number.isFinite(doseDay) ? doseDay : 0) : 0) : null;

  const warning = useMemo(() => {
    if (!stocking || !groups || (type === 'move-fish' && fields.direction !== 'in') || type === 'remove-fish') return null;
    return eventStocking(stocking, fields, editing);
  }, [stocking, groups, type, fields, editing]);

  return (
    <View testID="event-form" style={{ gap: space.md }}>
      {!editing ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }} accessibilityRole="radiogroup" accessibilityLabel="Kind of event">
          {EVENT_TYPES.map((t) => (
            <Pressable
              key={t.type}
              testID={`event-type-${t.type}`}
              accessibilityRole="radio"
              aria-checked={type === t.type}
              onPress={() => chooseType(t.type)}
              style={{
                minHeight: layout.minTouchTarget,
                justifyContent: 'center',
                paddingHorizontal: space.md,
                borderRadius: radii.pill,
                borderWidth: type === t.type ? 2 : 1,
                borderColor: type === t.type ? colors.primary : colors.fieldBorder,
                backgroundColor: type === t.type ? colors.navActiveSurface : colors.surface,
              }}
            >
              <AppText weight={type === t.type ? 'bold' : 'regular'}>{t.label}</AppText>
            </Pressable>
          ))}
        </View>
      ) : null}
      {FIELDS[type].map((spec) =>
        spec.shownWhen && !spec.shownWhen(fields) ? null : spec.choices ? (
          <View key={spec.key} style={{ gap: space.xs }}>
            <ChoiceGroup
              label={spec.label}
              hint={spec.hint}
              choices={spec.choices}
              value={fields[spec.key] ?? spec.choices[0].value}
              onChange={(v) => set(spec.key, v)}
              testID={`event-field-${spec.key}`}
            />
            {errors[spec.key] ? <AppText tone="dangerText">{`Error: ${errors[spec.key]}`}</AppText> : null}
          </View>
        ) : spec.key === 'direction' ? (
          <ChoiceGroup
            key={spec.key}
            label="Which way"
            value={fields.direction === 'out' ? 'out' : 'in'}
            onChange={(v) => set('direction', v)}
            choices={[
              { value: 'in', label: 'Into this tank' },
              { value: 'out', label: 'Out of this tank' },
            ]}
            testID="event-field-direction"
          />
        ) : (
          <TextField
            key={spec.key}
            label={spec.label}
            hint={spec.key === 'day' && dayHint ? dayHint : spec.hint}
            value={fields[spec.key] ?? ''}
            onChangeText={(v) => set(spec.key, v)}
            keyboardType={spec.numeric ? 'decimal-pad' : 'default'}
            autoCapitalize="none"
            error={errors[spec.key]}
            testID={`event-field-${spec.key}`}
          />
        ),
      )}
      {groups ? (
        <FishRows
          shape={groups}
          fields={fields}
          errors={errors}
          preferred={preferredSpecies}
          onSet={set}
          onChoose={(i, choice) => {
            setFields((f) => ({ ...f, [groupKey(i, 'species')]: choice.speciesId ?? '', [groupKey(i, 'name')]: choice.customName }));
            clearError(groupKey(i, 'species'), groupKey(i, 'name'), groupKey(i, 'lengthCm'), 'fish');
          }}
          onRemove={(i) => {
            setFields((f) => removeGroup(f, i));
            setErrors((e) => removeGroupErrors(e, i));
          }}
          onAdd={() => setFields(addGroup)}
        />
      ) : null}
      {errors.fish ? <AppText tone="dangerText" weight="bold">{`Error: ${errors.fish}`}</AppText> : null}
      {warning ? <Banner tone="watch" title="A lot of fish for this tank" message={warning} testID="event-stocking-warning" /> : null}
      {cautions ? (
        <View style={{ gap: space.sm }} testID="dose-cautions">
          {cautions.withFish.length > 0 ? (
            <Banner tone="watch" title="Fish are in the tank" testID="dose-caution-fish">
              {cautions.withFish.map((c) => (
                <AppText key={c}>{c}</AppText>
              ))}
            </Banner>
          ) : null}
          <Banner tone="info" title="Handling ammonia" testID="dose-caution-handling">
            <View style={{ gap: space.xs }}>
              {cautions.handling.map((c) => (
                <AppText key={c} variant="caption">{`• ${c}`}</AppText>
              ))}
            </View>
          </Banner>
        </View>
      ) : null}
      {errors._ || errors.type ? <AppText tone="dangerText">{`Error: ${errors._ ?? errors.type}`}</AppText> : null}
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label={editing ? 'Update event' : 'Add event'} onPress={submit} testID="event-submit" />
        {onCancel ? <Button label="Close" variant="secondary" onPress={onCancel} testID="event-cancel" /> : null}
      </View>
    </View>
  );
}

/** One row per kind of fish: who (the picker), how many, and for fish going in their size. */
function FishRows({
  shape,
  fields,
  errors,
  preferred,
  onSet,
  onChoose,
  onRemove,
  onAdd,
}: {
  shape: GroupShape;
  fields: EventFields;
  errors: Record<string, string>;
  preferred?: readonly string[];
  onSet(key: string, value: string): void;
  onChoose(index: number, choice: { speciesId: string | null; customName: string }): void;
  onRemove(index: number): void;
  onAdd(): void;
}) {
  const { space, colors } = useTheme();
  const n = groupCount(fields);
  return (
    <View style={{ gap: space.md }} testID="event-fish">
      {Array.from({ length: n }, (_, i) => {
        const speciesId = fields[groupKey(i, 'species')] || null;
        const customName = fields[groupKey(i, 'name')] ?? '';
        const known = speciesId ? findSpecies(speciesId) : undefined;
        const own = !speciesId && customName.trim() !== '';
        const label = n > 1 ? `Fish ${i + 1}` : 'Which fish';
        return (
          <View key={i} style={{ gap: space.sm, borderLeftWidth: n > 1 ? 3 : 0, borderLeftColor: colors.border, paddingLeft: n > 1 ? space.sm : 0 }} testID={`event-fish-${i}`}>
            <SpeciesPicker
              label={label}
              value={{ speciesId, customName }}
              onChange={(c) => onChoose(i, c)}
              error={errors[groupKey(i, 'species')] ?? errors[groupKey(i, 'name')]}
              preferred={preferred}
              allowCustom
              testID={`event-fish-${i}-species`}
            />
            <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
              <View style={{ flexGrow: 1, flexBasis: 110 }}>
                <TextField
                  label="How many"
                  value={fields[groupKey(i, 'count')] ?? ''}
                  onChangeText={(v) => onSet(groupKey(i, 'count'), v)}
                  keyboardType="number-pad"
                  inputMode="numeric"
                  error={errors[groupKey(i, 'count')]}
                  testID={`event-field-${groupKey(i, 'count')}`}
                />
              </View>
              {shape === 'sized' ? (
                <View style={{ flexGrow: 1, flexBasis: 110 }}>
                  <TextField
                    label="Length (cm)"
                    placeholder={known ? `about ${known.adultLengthCm}` : undefined}
                    value={fields[groupKey(i, 'lengthCm')] ?? ''}
                    onChangeText={(v) => onSet(groupKey(i, 'lengthCm'), v)}
                    keyboardType="decimal-pad"
                    inputMode="decimal"
                    error={errors[groupKey(i, 'lengthCm')]}
                    testID={`event-field-${groupKey(i, 'lengthCm')}`}
                  />
                </View>
              ) : null}
              {shape === 'sized' && (own || (fields[groupKey(i, 'massG')] ?? '') !== '') ? (
                <View style={{ flexGrow: 1, flexBasis: 110 }}>
                  <TextField
                    label="Mass of one (g)"
                    value={fields[groupKey(i, 'massG')] ?? ''}
                    onChangeText={(v) => onSet(groupKey(i, 'massG'), v)}
                    keyboardType="decimal-pad"
                    inputMode="decimal"
                    error={errors[groupKey(i, 'massG')]}
                    testID={`event-field-${groupKey(i, 'massG')}`}
                  />
                </View>
              ) : null}
            </View>
            {shape === 'sized' && (own || known) ? (
              <AppText variant="caption" tone="textMuted">
                {known
                  ? 'Leave the length empty for a typical adult.'
                  : 'Your own fish: give its length or the mass of one, so its waste can be estimated.'}
              </AppText>
            ) : null}
            {n > 1 ? (
              <Button
                label="Take this fish off the event"
                variant="quiet"
                accessibilityLabel={`Take fish ${i + 1} off the event`}
                onPress={() => onRemove(i)}
                testID={`event-fish-${i}-remove`}
              />
            ) : null}
          </View>
        );
      })}
      {canAddGroup(fields) ? <Button label="+ Another species" variant="secondary" onPress={onAdd} testID="event-add-group" /> : null}
    </View>
  );
}
