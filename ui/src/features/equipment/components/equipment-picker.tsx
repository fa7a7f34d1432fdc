import { useState } from 'react';
import { Combobox, Field, Option, type ComboboxProps } from '@fluentui/react-components';
import type { EquipmentKind, EquipmentResponse } from '@beamwright/link-core/contracts';
import { useEquipment } from '@/features/equipment/api/get-equipment';

export interface EquipmentPickerProps {
  kind: EquipmentKind;
  onPick: (item: EquipmentResponse) => void;
}

const KIND_WORD: Record<EquipmentKind, string> = { transmitter: 'transmitter', receiver: 'receiver' };

/** Pick a model from the organisation's catalogue to fill the fields; the values stay editable. */
export function EquipmentPicker({ kind, onPick }: EquipmentPickerProps) {
  const equipment = useEquipment(kind);
  const items = equipment.data ?? [];
  const [picked, setPicked] = useState<string | null>(null);
  const onOptionSelect: ComboboxProps['onOptionSelect'] = (_, data) => {
    const item = items.find((candidate) => candidate.id === data.optionValue);
    if (!item) return;
    onPick(item);
    setPicked(item.name);
  };
  return (
    <Field
      label={`Fill from the ${KIND_WORD[kind]} catalogue`}
      hint={
        equipment.isError
          ? 'The catalogue could not be loaded; type the values in.'
          : picked
            ? `Fields below filled from ${picked}; later edits are yours.`
            : 'Copies the model’s datasheet figures into the fields below; you can still edit them.'
      }
    >
      <Combobox
        placeholder={equipment.isPending ? 'Loading the catalogue…' : items.length === 0 ? 'No models in the catalogue' : `Choose a ${KIND_WORD[kind]} model`}
        disabled={items.length === 0}
        onOptionSelect={onOptionSelect}
        aria-label={`${KIND_WORD[kind]} model from the catalogue`}
        data-testid={`equipment-picker-${kind}`}
      >
        {items.map((item) => (
          <Option key={item.id} value={item.id} text={item.name}>
            {item.name}
            {item.maker ? ` · ${item.maker}` : ''}
            {item.illustrative ? ' (illustrative figures)' : ''}
          </Option>
        ))}
      </Combobox>
    </Field>
  );
}
