using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace NetAdjust.IO.Text;

/// <summary>
/// Fast conversions of doubles to text that give exactly the characters of the runtime's invariant formats: the
/// fixed-point format <c>"F<i>d</i>"</c> (text reports) and the shortest round-trip format (JSON numbers). The
/// writers of large networks format millions of numbers, and the runtime's fixed format always takes its slow exact
/// path (big-integer arithmetic). Values these methods cannot settle cheaply and exactly (ties, very large or very
/// small magnitudes, negative zero, non-finite values, exponent notation) are handed to the runtime, so the text is
/// always the runtime's own.
/// </summary>
internal static class NumberText
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private static readonly string[] FixedFormats = ["F0", "F1", "F2", "F3", "F4", "F5", "F6", "F7", "F8"];
    private static readonly ulong[] Pow10 =
    [
        1UL, 10UL, 100UL, 1_000UL, 10_000UL, 100_000UL, 1_000_000UL, 10_000_000UL, 100_000_000UL,
        1_000_000_000UL, 10_000_000_000UL, 100_000_000_000UL, 1_000_000_000_000UL, 10_000_000_000_000UL,
        100_000_000_000_000UL, 1_000_000_000_000_000UL, 10_000_000_000_000_000UL, 100_000_000_000_000_000UL,
        1_000_000_000_000_000_000UL, 10_000_000_000_000_000_000UL,
    ];

    /// <summary>The text of <c>value.ToString("F" + decimals, CultureInfo.InvariantCulture)</c>.</summary>
    /// <param name="value">The value.</param>
    /// <param name="decimals">The number of decimals (0 or more).</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static string Fixed(double value, int decimals)
    {
        Span<char> text = stackalloc char[48];
        return TryFixed(value, decimals, text, out int written)
            ? new string(text[..written])
            : value.ToString(decimals < FixedFormats.Length ? FixedFormats[decimals] : "F" + decimals, Inv);
    }

    /// <summary>Writes the fixed-point text when it can be settled exactly without big-integer arithmetic.</summary>
    /// <returns>False when the runtime's formatter must decide (nothing is then written).</returns>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static bool TryFixed(double value, int decimals, Span<char> text, out int written)
    {
        written = 0;
        if ((uint)decimals > 8) return false;
        long bits = BitConverter.DoubleToInt64Bits(value);
        bool negative = bits < 0;
        int biased = (int)((bits >> 52) & 0x7FF);
        ulong fraction = (ulong)bits & 0xF_FFFF_FFFF_FFFFUL;
        if (biased == 0x7FF || biased == 0 && (fraction != 0 || negative)) return false; // NaN, ∞, subnormal, -0
        ulong digits = 0; // the value times 10^decimals, rounded to an integer
        if (biased != 0)
        {
            ulong m = fraction | (1UL << 52);
            int e = biased - 1075;
            ulong hi = Math.BigMul(m, Pow10[decimals], out ulong lo); // m·10^d < 2^80, exact
            if (e >= 0)
            {
                if (e > 10 || hi != 0 || lo >> (63 - e) != 0) return false; // too large for 64 bits
                digits = lo << e;
            }
            else if (!RoundShifted(hi, lo, -e, out digits)) return false;
        }
        if (negative && digits == 0) return false; // "-0.00": the runtime's sign rule decides
        // the digits from the right: the decimals, the point, then at least one digit of the whole part
        Span<char> buffer = stackalloc char[24];
        int at = buffer.Length;
        for (int i = 0; i < decimals; i++)
        {
            ulong rest = digits / 10;
            buffer[--at] = (char)('0' + (int)(digits - (rest * 10)));
            digits = rest;
        }
        if (decimals > 0) buffer[--at] = '.';
        do
        {
            ulong rest = digits / 10;
            buffer[--at] = (char)('0' + (int)(digits - (rest * 10)));
            digits = rest;
        }
        while (digits != 0);
        int pos = 0;
        if (negative) text[pos++] = '-';
        buffer[at..].CopyTo(text[pos..]);
        pos += buffer.Length - at;
        written = pos;
        return true;
    }

    /// <summary>(hi:lo) / 2^s rounded to the nearest integer, for 0 &lt; s; false on an exact tie (the runtime's
    /// rule decides) or a quotient beyond 64 bits.</summary>
    private static bool RoundShifted(ulong hi, ulong lo, int s, out ulong rounded)
    {
        rounded = 0;
        ulong q, qHigh, rHigh, rLow, halfHigh, halfLow;
        if (s < 64)
        {
            q = (lo >> s) | (hi << (64 - s));
            qHigh = hi >> s;
            rHigh = 0;
            rLow = lo & ((1UL << s) - 1);
            halfHigh = 0;
            halfLow = 1UL << (s - 1);
        }
        else if (s < 128)
        {
            q = s == 64 ? hi : hi >> (s - 64);
            qHigh = 0;
            rHigh = s == 64 ? 0 : hi & ((1UL << (s - 64)) - 1);
            rLow = lo;
            (halfHigh, halfLow) = s == 64 ? (0UL, 1UL << 63) : (1UL << (s - 65), 0UL);
        }
        else return true; // (hi:lo) < 2^80 lies below half of 2^s: rounds to 0
        if (qHigh != 0) return false;
        int order = rHigh != halfHigh ? rHigh.CompareTo(halfHigh) : rLow.CompareTo(halfLow);
        if (order == 0) return false;
        if (order > 0)
        {
            if (q == ulong.MaxValue) return false;
            q++;
        }
        rounded = q;
        return true;
    }

    /// <summary>Writes the UTF-8 text of <c>value.ToString(CultureInfo.InvariantCulture)</c> (the shortest text
    /// that reads back to the same double, as JSON writers write numbers).</summary>
    /// <param name="value">The value.</param>
    /// <param name="utf8">At least 32 bytes.</param>
    /// <returns>The bytes written.</returns>
    public static int Shortest(double value, Span<byte> utf8)
    {
        if (TryShortest(value, utf8, out int written)) return written;
        if (!value.TryFormat(utf8, out written, default, Inv)) throw new ArgumentException("buffer too small");
        return written;
    }

    /// <summary>Writes the shortest round-trip text in positional notation (Ryu, Adams 2018) when the runtime would
    /// write it so too.</summary>
    /// <returns>False when the runtime's formatter must write it (nothing is then written).</returns>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static bool TryShortest(double value, Span<byte> utf8, out int written)
    {
        written = 0;
        long bits = BitConverter.DoubleToInt64Bits(value);
        bool negative = bits < 0;
        int biased = (int)((bits >> 52) & 0x7FF);
        ulong fraction = (ulong)bits & 0xF_FFFF_FFFF_FFFFUL;
        if (biased == 0x7FF || biased == 0) // NaN, ∞, zeros and subnormals
        {
            if (bits != 0) return false;
            utf8[0] = (byte)'0';
            written = 1;
            return true;
        }
        var (output, exponent) = Ryu.Shortest(fraction, biased);
        int length = DecimalLength(output);
        int scale = exponent + length; // the position of the decimal point after the first digit's place
        // The runtime writes exponent notation when scale > max(digits, 15) or scale < -3.
        if (scale > Math.Max(length, 15) || scale < -3) return false;
        Span<byte> digits = stackalloc byte[20];
        int at = length;
        while (output >= 100)
        {
            ulong rest = output / 100;
            int pair = (int)(output - (rest * 100));
            digits[--at] = (byte)('0' + (pair % 10));
            digits[--at] = (byte)('0' + (pair / 10));
            output = rest;
        }
        if (output >= 10)
        {
            digits[--at] = (byte)('0' + (int)(output % 10));
            output /= 10;
        }
        if (at > 0) digits[0] = (byte)('0' + (int)output);
        int pos = 0;
        if (negative) utf8[pos++] = (byte)'-';
        if (scale <= 0)
        {
            utf8[pos++] = (byte)'0';
            utf8[pos++] = (byte)'.';
            for (int i = 0; i < -scale; i++) utf8[pos++] = (byte)'0';
            digits[..length].CopyTo(utf8[pos..]);
            pos += length;
        }
        else if (scale >= length)
        {
            digits[..length].CopyTo(utf8[pos..]);
            pos += length;
            for (int i = length; i < scale; i++) utf8[pos++] = (byte)'0';
        }
        else
        {
            digits[..scale].CopyTo(utf8[pos..]);
            pos += scale;
            utf8[pos++] = (byte)'.';
            digits[scale..length].CopyTo(utf8[pos..]);
            pos += length - scale;
        }
        written = pos;
        return true;
    }

    private static int DecimalLength(ulong v)
    {
        int n = 1;
        while (n < 20 && v >= Pow10[n]) n++;
        return n;
    }

    /// <summary>
    /// The shortest decimal that reads back to a double, after Adams, U. (2018), "Ryū: fast float-to-string
    /// conversion", PLDI 2018, doi:10.1145/3192366.3192369 (the 64-bit algorithm with 125-bit tables of powers of
    /// five, computed here once with big integers).
    /// </summary>
    private static class Ryu
    {
        private const int MantissaBits = 52, Bias = 1023, Pow5InvBits = 125, Pow5Bits = 125;
        private static readonly (ulong Lo, ulong Hi)[] Pow5Split = Table(326, inverse: false);
        private static readonly (ulong Lo, ulong Hi)[] Pow5InvSplit = Table(342, inverse: true);

        private static (ulong Lo, ulong Hi)[] Table(int size, bool inverse)
        {
            var table = new (ulong, ulong)[size];
            var mask = (BigInteger.One << 64) - 1;
            for (int i = 0; i < size; i++)
            {
                var pow = BigInteger.Pow(5, i);
                int length = (int)pow.GetBitLength();
                BigInteger v = inverse
                    ? (BigInteger.One << (length - 1 + Pow5InvBits)) / pow + 1
                    : length >= Pow5Bits ? pow >> (length - Pow5Bits) : pow << (Pow5Bits - length);
                table[i] = ((ulong)(v & mask), (ulong)(v >> 64));
            }
            return table;
        }

        private static int Pow5BitCount(int e) => (int)(((uint)e * 1217359) >> 19) + 1;
        private static int Log10Pow2(int e) => (int)(((uint)e * 78913) >> 18);
        private static int Log10Pow5(int e) => (int)(((uint)e * 732923) >> 20);

        private static bool MultipleOfPowerOf5(ulong value, int p)
        {
            int count = 0;
            while (value > 0 && value % 5 == 0)
            {
                value /= 5;
                count++;
            }
            return count >= p;
        }

        /// <summary>(m × mul) >> j for a 125-bit multiplier and 64 &lt; j &lt; 128 (the shift Ryu's tables give).
        /// </summary>
        private static ulong MulShift(ulong m, (ulong Lo, ulong Hi) mul, int j)
        {
            ulong high0 = Math.BigMul(m, mul.Lo, out _);
            ulong high1 = Math.BigMul(m, mul.Hi, out ulong low1);
            ulong sum = low1 + high0;
            if (sum < high0) high1++;
            int shift = j - 64;
            return (sum >> shift) | (high1 << (64 - shift));
        }

        /// <summary>The digits and the decimal exponent of the shortest decimal of a finite, non-zero double.
        /// </summary>
        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public static (ulong Output, int Exponent) Shortest(ulong ieeeMantissa, int ieeeExponent)
        {
            int e2;
            ulong m2;
            if (ieeeExponent == 0)
            {
                e2 = 1 - Bias - MantissaBits - 2;
                m2 = ieeeMantissa;
            }
            else
            {
                e2 = ieeeExponent - Bias - MantissaBits - 2;
                m2 = (1UL << MantissaBits) | ieeeMantissa;
            }
            bool even = (m2 & 1) == 0, acceptBounds = even;
            ulong mv = 4 * m2;
            uint mmShift = ieeeMantissa != 0 || ieeeExponent <= 1 ? 1u : 0u;
            ulong vr, vp, vm;
            int e10;
            bool vmIsTrailingZeros = false, vrIsTrailingZeros = false;
            if (e2 >= 0)
            {
                int q = Log10Pow2(e2) - (e2 > 3 ? 1 : 0);
                e10 = q;
                int k = Pow5InvBits + Pow5BitCount(q) - 1;
                int i = -e2 + q + k;
                var mul = Pow5InvSplit[q];
                vr = MulShift(4 * m2, mul, i);
                vp = MulShift((4 * m2) + 2, mul, i);
                vm = MulShift((4 * m2) - 1 - mmShift, mul, i);
                if (q <= 21)
                {
                    if (mv % 5 == 0) vrIsTrailingZeros = MultipleOfPowerOf5(mv, q);
                    else if (acceptBounds) vmIsTrailingZeros = MultipleOfPowerOf5(mv - 1 - mmShift, q);
                    else vp -= MultipleOfPowerOf5(mv + 2, q) ? 1UL : 0UL;
                }
            }
            else
            {
                int q = Log10Pow5(-e2) - (-e2 > 1 ? 1 : 0);
                e10 = q + e2;
                int i = -e2 - q;
                int k = Pow5BitCount(i) - Pow5Bits;
                int j = q - k;
                var mul = Pow5Split[i];
                vr = MulShift(4 * m2, mul, j);
                vp = MulShift((4 * m2) + 2, mul, j);
                vm = MulShift((4 * m2) - 1 - mmShift, mul, j);
                if (q <= 1)
                {
                    vrIsTrailingZeros = true;
                    if (acceptBounds) vmIsTrailingZeros = mmShift == 1;
                    else vp--;
                }
                else if (q < 63)
                {
                    vrIsTrailingZeros = (mv & ((1UL << q) - 1)) == 0;
                }
            }

            int removed = 0;
            int lastRemovedDigit = 0;
            ulong output;
            if (vmIsTrailingZeros || vrIsTrailingZeros)
            {
                // (the rare case: the bounds or the value itself end in zeros) drops one digit of all three
                void Drop()
                {
                    vrIsTrailingZeros &= lastRemovedDigit == 0;
                    lastRemovedDigit = (int)(vr % 10);
                    vr /= 10;
                    vp /= 10;
                    vm /= 10;
                    removed++;
                }
                while (vp / 10 > vm / 10)
                {
                    vmIsTrailingZeros &= vm % 10 == 0;
                    Drop();
                }
                if (vmIsTrailingZeros)
                    while (vm % 10 == 0) Drop();
                if (vrIsTrailingZeros && lastRemovedDigit == 5 && vr % 2 == 0) lastRemovedDigit = 4;
                output = vr + ((vr == vm && (!acceptBounds || !vmIsTrailingZeros)) || lastRemovedDigit >= 5
                    ? 1UL : 0UL);
            }
            else
            {
                bool roundUp = false;
                if (vp / 100 > vm / 100)
                {
                    roundUp = vr % 100 >= 50;
                    vr /= 100;
                    vp /= 100;
                    vm /= 100;
                    removed += 2;
                }
                while (vp / 10 > vm / 10)
                {
                    roundUp = vr % 10 >= 5;
                    vr /= 10;
                    vp /= 10;
                    vm /= 10;
                    removed++;
                }
                output = vr + (vr == vm || roundUp ? 1UL : 0UL);
            }
            return (output, e10 + removed);
        }
    }
}
