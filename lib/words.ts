// Changing the case of a sentence's first letter, for labels and messages that start or sit
// inside a sentence ("Cost per event" → "the cost per event", "no source" → "No source").

export const upperFirst = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);

export const lowerFirst = (text: string): string => text.charAt(0).toLowerCase() + text.slice(1);
