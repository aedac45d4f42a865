import { Linking } from 'react-native';

/** Native: open the file's address; the system offers to save or share it. */
export async function saveDownload(url: string, _fallbackName: string): Promise<void> {
  await Linking.openURL(url);
}
