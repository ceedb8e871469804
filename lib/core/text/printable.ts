// Text for PDFs: react-pdf cannot draw colour emoji, and a glyph that no shipped font has prints as
// an empty box. `printableText` keeps every letter our PDF fonts cover (Latin, Greek, Cyrillic and
// symbols via DejaVu Sans; Chinese and Japanese via Droid Sans Fallback, Korean via Nanum Gothic; see lib/server/pdf.ts)
// and writes emoji as their names in brackets ("[red heart]"), the rest as "[symbol]". Pure.
//
// Emoji names are the CLDR short names (unicode.org/emoji/charts/full-emoji-list.html), written here
// from memory for the common ones; an emoji not in the table prints as "[symbol]".

const NAMES: Record<string, string> = {
  "😀": "grinning face", "😃": "grinning face", "😄": "grinning face", "😁": "beaming face", "😆": "laughing face",
  "😅": "grinning face with sweat", "😂": "face with tears of joy", "🤣": "rolling on the floor laughing",
  "🙂": "slightly smiling face", "😉": "winking face", "😊": "smiling face", "😇": "smiling face with halo",
  "🥰": "smiling face with hearts", "😍": "smiling face with heart-eyes", "😘": "face blowing a kiss",
  "😋": "face savouring food", "😎": "smiling face with sunglasses", "🤗": "hugging face", "🤔": "thinking face",
  "😐": "neutral face", "🙄": "face with rolling eyes", "😏": "smirking face", "😢": "crying face", "😭": "loudly crying face",
  "😮": "face with open mouth", "😱": "face screaming in fear", "😡": "angry face", "😴": "sleeping face",
  "🥳": "partying face", "🥺": "pleading face", "😬": "grimacing face", "🙃": "upside-down face", "😜": "winking face with tongue",
  "❤": "red heart", "🧡": "orange heart", "💛": "yellow heart", "💚": "green heart", "💙": "blue heart", "💜": "purple heart",
  "🖤": "black heart", "🤍": "white heart", "🤎": "brown heart", "💕": "two hearts", "💖": "sparkling heart", "💔": "broken heart",
  "💗": "growing heart", "💓": "beating heart", "💘": "heart with arrow", "💝": "heart with ribbon",
  "👍": "thumbs up", "👎": "thumbs down", "👏": "clapping hands", "🙏": "folded hands", "👋": "waving hand", "👌": "OK hand",
  "✌": "victory hand", "🤞": "crossed fingers", "💪": "flexed biceps", "🙌": "raising hands", "✋": "raised hand", "👉": "backhand index pointing right",
  "👈": "backhand index pointing left", "☝": "index pointing up",
  "👩": "woman", "👨": "man", "👧": "girl", "👦": "boy", "👶": "baby", "🧒": "child", "🧑": "person", "👵": "old woman", "👴": "old man",
  "💻": "laptop", "🎨": "artist palette", "🔧": "wrench", "🍳": "cooking", "🌾": "sheaf of rice", "🎓": "graduation cap",
  "🧶": "yarn", "🧵": "thread", "🪡": "sewing needle", "🧤": "gloves", "🧣": "scarf", "🧦": "socks", "👕": "t-shirt", "👗": "dress",
  "🧥": "coat", "👒": "woman's hat", "🎩": "top hat", "👶🏻": "baby",
  "🎁": "wrapped gift", "🎉": "party popper", "🎊": "confetti ball", "🎂": "birthday cake", "🎄": "Christmas tree", "🎅": "Santa Claus",
  "⭐": "star", "🌟": "glowing star", "✨": "sparkles", "🔥": "fire", "💧": "droplet", "❄": "snowflake", "☀": "sun", "🌈": "rainbow",
  "☁": "cloud", "⛄": "snowman without snow", "☃": "snowman", "🌙": "crescent moon", "⚡": "high voltage",
  "🌸": "cherry blossom", "🌹": "rose", "🌻": "sunflower", "🌷": "tulip", "🌿": "herb", "🍀": "four leaf clover", "🍁": "maple leaf", "🌲": "evergreen tree",
  "🐑": "ewe", "🐏": "ram", "🦙": "llama", "🐐": "goat", "🐇": "rabbit", "🐰": "rabbit face", "🐱": "cat face", "🐈": "cat",
  "🐶": "dog face", "🐕": "dog", "🐻": "bear", "🦊": "fox", "🐦": "bird", "🦋": "butterfly", "🐝": "honeybee", "🦔": "hedgehog",
  "☕": "hot beverage", "🍵": "teacup without handle", "🍰": "shortcake", "🍪": "cookie", "🍎": "red apple", "🍓": "strawberry",
  "🏠": "house", "🏡": "house with garden", "📦": "package", "✉": "envelope", "📧": "e-mail", "📞": "telephone receiver", "📱": "mobile phone",
  "📷": "camera", "📅": "calendar", "⏰": "alarm clock", "⌛": "hourglass done", "⏳": "hourglass not done", "⌚": "watch",
  "✅": "check mark button", "✔": "check mark", "❌": "cross mark", "❗": "red exclamation mark", "❓": "red question mark", "⚠": "warning",
  "💯": "hundred points", "🆗": "OK button", "🆕": "NEW button", "➕": "plus", "➖": "minus",
  "🚚": "delivery truck", "✈": "airplane", "🚗": "automobile", "🚲": "bicycle", "🏴": "black flag", "🏳": "white flag",
  "💰": "money bag", "💳": "credit card", "💶": "euro banknote", "💷": "pound banknote", "💵": "dollar banknote",
  "👀": "eyes", "💤": "zzz", "💡": "light bulb", "📌": "pushpin", "📎": "paperclip", "✂": "scissors", "🔒": "locked", "🔑": "key",
  "🤝": "handshake", "🫶": "heart hands", "🥶": "cold face", "🥵": "hot face", "🤩": "star-struck", "😻": "smiling cat with heart-eyes",
};

const RI_START = 0x1f1e6; // REGIONAL INDICATOR SYMBOL LETTER A
const PICT = String.raw`(?:\p{Extended_Pictographic}|\p{Emoji_Presentation})`;
const MODS = String.raw`[\u{1F3FB}-\u{1F3FF}\u{FE0F}\u{FE0E}]*[\u{E0020}-\u{E007F}]*`;
/** One emoji as a person sees it: a flag, a keycap, or pictographs joined by zero-width joiners. */
const EMOJI = new RegExp(
  String.raw`[\u{1F1E6}-\u{1F1FF}]{2}|[0-9#*]\u{FE0F}?\u{20E3}|${PICT}${MODS}(?:\u{200D}${PICT}${MODS})*`,
  "gu",
);
const PRESENTATION = /\p{Emoji_Presentation}/u;
const STRIP = /[\u{1F3FB}-\u{1F3FF}\u{FE0F}\u{FE0E}\u{E0020}-\u{E007F}]/gu;

function nameOf(seq: string): string {
  const first = seq.codePointAt(0) ?? 0;
  if (first >= RI_START && first <= RI_START + 25) {
    const letters = [...seq].map((c) => String.fromCharCode(0x41 + (c.codePointAt(0)! - RI_START))).join("");
    return `[flag ${letters}]`;
  }
  if (seq.includes("\u20E3")) return `[keycap ${seq[0]}]`;
  const names = seq
    .split("\u200D")
    .map((part) => NAMES[part.replace(STRIP, "")])
    .filter((n): n is string => Boolean(n));
  return names.length ? `[${names.join(" ")}]` : "[symbol]";
}

function emojiToWords(match: string): string {
  const cp = match.codePointAt(0) ?? 0;
  // A pictograph shown as text by default (©, ™, ☀, ★ …) is drawn by our fonts: keep it as it is,
  // unless it asks for emoji presentation (U+FE0F) or lives outside the Basic Multilingual Plane.
  const single = [...match.replace(/\u{FE0E}/gu, "")].length === 1;
  if (single && cp < 0x10000 && !PRESENTATION.test(match)) return match.replace(/\u{FE0E}/gu, "");
  return nameOf(match);
}

/** Characters no PDF font of ours draws, and invisible controls. */
function otherChar(ch: string): string {
  const cp = ch.codePointAt(0) ?? 0;
  if (ch === "\n" || ch === "\t") return ch;
  if (cp < 0x20 || (cp >= 0x7f && cp < 0xa0)) return ""; // control characters
  if (cp === 0x200d || cp === 0xfe0f || cp === 0xfe0e || (cp >= 0xe0020 && cp <= 0xe007f) || (cp >= 0x1f3fb && cp <= 0x1f3ff)) return "";
  if (cp >= 0xd800 && cp <= 0xdfff) return "[symbol]"; // a lone surrogate
  if ((cp >= 0xe000 && cp <= 0xf8ff) || cp >= 0xf0000) return "[symbol]"; // private use
  // "Fancy" letters (mathematical bold, script …) used in names become plain letters.
  if (cp >= 0x1d400 && cp <= 0x1d7ff) return ch.normalize("NFKC");
  if (cp >= 0x10000) return "[symbol]"; // beyond the fonts we ship
  return ch;
}

/** `text` as our PDF fonts can print it: emoji as "[name]", unknown or undrawable characters as "[symbol]". */
export function printableText(text: string): string {
  // Fast path: plain ASCII text (almost everything) is returned as it is.
  if (/^[\x20-\x7e\n\t]*$/.test(text)) return text;
  const named = text.normalize("NFC").replace(EMOJI, emojiToWords);
  let out = "";
  for (const ch of named) out += otherChar(ch);
  return out;
}
