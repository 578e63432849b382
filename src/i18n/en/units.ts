// Messages for lengths as people type them (BaseLengthInput), by the refusal's code in shared/units.ts.
export default {
  parse: {
    empty: 'Type a length.',
    negative: 'A length cannot be negative.',
    zero_denominator: 'A fraction cannot have 0 below the line.',
    decimal_comma: 'Write decimals with a point (1.5) and no thousands separator.',
    unreadable: 'Lumenyard cannot read this as a length. Try 7 3/4", 7.75 in, 190 mm or 5\' 2".',
  },
}
