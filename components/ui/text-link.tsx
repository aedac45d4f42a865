import { Link, type Href } from 'expo-router';
import { useTheme } from '@/hooks/use-theme';
import type { TypeVariant } from '@/constants/theme';

export interface TextLinkProps {
  href: Href;
  label: string;
  accessibilityLabel?: string;
  testID?: string;
  variant?: TypeVariant;
}

/** An underlined in-app link (an <a> on the web), tall enough to tap. */
export function TextLink({ href, label, accessibilityLabel, testID, variant = 'body' }: TextLinkProps) {
  const { colors, font, type, space } = useTheme();
  return (
    <Link
      href={href}
      testID={testID}
      accessibilityRole="link"
      accessibilityLabel={accessibilityLabel ?? label}
      style={[
        type[variant],
        font.bold,
        { color: colors.link, textDecorationLine: 'underline', paddingVertical: space.sm, alignSelf: 'flex-start' },
      ]}
    >
      {label}
    </Link>
  );
}
