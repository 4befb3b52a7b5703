// Passwords of 8 characters or more that top the published breach-corpus lists (from memory of
// the widely shared "most common passwords" lists; kept short on purpose: the list catches the
// worst choices, the length rule does the rest). Stored lower-case.
const LIST = `
12345678 123456789 1234567890 password password1 password12 password123 passw0rd p@ssw0rd p@ssword
qwertyuiop qwerty123 qwerty12 1q2w3e4r 1q2w3e4r5t 1qaz2wsx zaq12wsx qazwsxedc asdfghjkl asdfasdf
iloveyou iloveyou1 11111111 00000000 88888888 87654321 12341234 11223344 abcd1234 abc12345
sunshine princess football baseball superman batman123 starwars welcome1 welcome123 letmein1
trustno1 whatever dragon123 monkey123 shadow12 michael1 jennifer charlie1 freedom1 computer
internet sporewell changeme changeme1 administrator admin123 admin1234 rootroot 123qweasd
q1w2e3r4 q1w2e3r4t5 aa123456 a1234567 a12345678 zxcvbnm1 zxcvbnmm 987654321 123123123 12121212
696969696 unicorn1 pokemon1 master12 mustang1 access14 jordan23 harley12 ranger12 killer12
loveme12 lovely12 flower12 summer12 hello123 hello1234 secret12 secret123 default1 temp1234
farmer12 garden12 gardening compost1 tomatoes mushroom
`;

export const COMMON_PASSWORDS: ReadonlySet<string> = new Set(LIST.split(/\s+/).filter(Boolean));
