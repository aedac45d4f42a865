import { useEffect, useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import type { ScenarioEvent } from '@/simulation/scenario';
import { CATALOGUE } from '@/simulation/catalogue';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { Banner } from '@/components/ui/banner';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { EVENT_TYPES, FIELDS, blankFields, eventToFields, fieldsToEvent, type EventFields, type EventType } from '@/components/plans/event-fields';
import { num } from '@/components/plans/event-kinds';
import { doseFormCautions } from '@/components/plans/dose-cautions';

export interface EventFormProps {
  /** The event being edited, or null for a new one. */
  editing: ScenarioEvent | null;
  onSubmit(event: ScenarioEvent): void;
  onCancel?(): void;
  /** Help under the day field when "the plan start" is not the right words (a lesson's day 0). */
  dayHint?: string;
  /** Fish in the tank on a day (for the dose form's caution); absent: not known. */
  fishOnDay?(day: number): number;
}

/** Add or edit one event: pick its kind, fill in a few numbers; errors appear under each field. */
export function EventForm({ editing, onSubmit, onCancel, dayHint, fishOnDay }: EventFormProps) {
  const { space, colors, radii, layout } = useTheme();
  const [type, setType] = useState<EventType>(editing?.type ?? 'add-fish');
  const [fields, setFields] = useState<EventFields>(editing ? eventToFields(editing) : blankFields('add-fish'));
  const [errors, setErrors] = useState<Record<string, string>>({});

  useEffect(() => {
    setType(editing?.type ?? 'add-fish');
    setFields(editing ? eventToFields(editing) : blankFields('add-fish'));
    setErrors({});
  }, [editing]);

  const chooseType = (t: EventType) => {
    setType(t);
    setFields((f) => ({ ...blankFields(t, Number(f.day) || 0), ...(f.species ? { species: f.species } : {}) }));
    setErrors({});
  };
  const submit = () => {
    const result = fieldsToEvent(type, fields);
    if ('errors' in result) return setErrors(result.errors);
    setErrors({});
    onSubmit(result.event);
    if (!editing) setFields(blankFields(type, Number(fields.day) || 0));
  };
  const doseDay = num(fields.day) ?? 0;
  const cautions = type === 'ammonia-dose' ? doseFormCautions(fishOnDay ? fishOnDay(Number.isFinite(doseDay) ? doseDay : 0) : 0) : null;
  const speciesText = (fields.species ?? '').trim().toLowerCase();
  const suggestions =
    speciesText.length >= 2 ? CATALOGUE.filter((c) => c.commonName.toLowerCase().includes(speciesText) || c.id.includes(speciesText)).slice(0, 4) : [];

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
      {FIELDS[type].map((spec) => {
        if (spec.shownWhen && !spec.shownWhen(fields)) return null;
        if (spec.choices) {
          return (
            <View key={spec.key} style={{ gap: space.xs }}>
              <ChoiceGroup
                label={spec.label}
                hint={spec.hint}
                choices={spec.choices}
                value={fields[spec.key] ?? spec.choices[0].value}
                onChange={(v) => setFields((f) => ({ ...f, [spec.key]: v }))}
                testID={`event-field-${spec.key}`}
              />
              {errors[spec.key] ? <AppText tone="dangerText">{`Error: ${errors[spec.key]}`}</AppText> : null}
            </View>
          );
        }
        return (
        <View key={spec.key} style={{ gap: space.xs }}>
          <TextField
            label={spec.label}
            hint={spec.key === 'day' && dayHint ? dayHint : spec.hint}
            value={fields[spec.key] ?? ''}
            onChangeText={(v) => setFields((f) => ({ ...f, [spec.key]: v }))}
            keyboardType={spec.numeric ? 'decimal-pad' : 'default'}
            autoCapitalize="none"
            error={errors[spec.key]}
            testID={`event-field-${spec.key}`}
          />
          {spec.key === 'species' && suggestions.length > 0 && !suggestions.some((c) => c.id === fields.species) ? (
            <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
              {suggestions.map((c) => (
                <Button key={c.id} label={c.commonName} variant="secondary" onPress={() => setFields((f) => ({ ...f, species: c.id }))} testID={`species-${c.id}`} />
              ))}
            </View>
          ) : null}
        </View>
        );
      })}
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
