using System.Buffers.Binary;
using System.IO.Compression;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// A minimal PNG decoder for test screenshots: 8-bit RGB or RGBA, not interlaced (PNG specification,
/// W3C Recommendation, 2nd ed. 2003: chunks §5, zlib stream §10, filters §9). Enough to judge pixels.
/// </summary>
internal sealed class PngImage
{
    private PngImage(int width, int height, byte[] rgba) { Width = width; Height = height; Rgba = rgba; }

    public int Width { get; }

    public int Height { get; }

    /// <summary>Pixels row by row, 4 bytes each (R, G, B, A).</summary>
    public byte[] Rgba { get; }

    public (byte R, byte G, byte B) this[int x, int y]
    {
        get { int i = 4 * ((y * Width) + x); return (Rgba[i], Rgba[i + 1], Rgba[i + 2]); }
    }

    public static PngImage Read(byte[] file)
    {
        ReadOnlySpan<byte> sig = [137, 80, 78, 71, 13, 10, 26, 10];
        if (file.Length < 8 || !file.AsSpan(0, 8).SequenceEqual(sig)) throw new InvalidDataException("not a PNG file");
        int pos = 8, width = 0, height = 0, colourType = -1;
        using var idat = new MemoryStream();
        while (pos + 8 <= file.Length)
        {
            int len = BinaryPrimitives.ReadInt32BigEndian(file.AsSpan(pos));
            string type = System.Text.Encoding.ASCII.GetString(file, pos + 4, 4);
            var data = file.AsSpan(pos + 8, len);
            if (type == "IHDR")
            {
                width = BinaryPrimitives.ReadInt32BigEndian(data);
                height = BinaryPrimitives.ReadInt32BigEndian(data[4..]);
                int depth = data[8];
                colourType = data[9];
                if (depth != 8 || (colourType != 2 && colourType != 6) || data[12] != 0)
                    throw new NotSupportedException(
                        $"PNG with depth {depth}, colour type {colourType}, interlace {data[12]} is not supported");
            }
            else if (type == "IDAT") idat.Write(data);
            else if (type == "IEND") break;
            pos += 12 + len;
        }
        int bpp = colourType == 6 ? 4 : 3;
        int stride = width * bpp;
        var raw = new MemoryStream();
        idat.Position = 0;
        using (var z = new ZLibStream(idat, CompressionMode.Decompress)) z.CopyTo(raw);
        var src = raw.ToArray();
        if (src.Length < height * (stride + 1)) throw new InvalidDataException("PNG image data is truncated");
        var cur = new byte[stride];
        var prev = new byte[stride];
        var rgba = new byte[width * height * 4];
        for (int y = 0; y < height; y++)
        {
            int f = src[y * (stride + 1)];
            Array.Copy(src, (y * (stride + 1)) + 1, cur, 0, stride);
            for (int i = 0; i < stride; i++)
            {
                int a = i >= bpp ? cur[i - bpp] : 0, b = prev[i], c = i >= bpp ? prev[i - bpp] : 0;
                int add = f switch
                {
                    0 => 0,
                    1 => a,
                    2 => b,
                    3 => (a + b) / 2,
                    4 => Paeth(a, b, c),
                    _ => throw new InvalidDataException($"unknown PNG filter {f}"),
                };
                cur[i] = (byte)(cur[i] + add);
            }
            for (int x = 0; x < width; x++)
            {
                int o = 4 * ((y * width) + x);
                rgba[o] = cur[x * bpp]; rgba[o + 1] = cur[(x * bpp) + 1]; rgba[o + 2] = cur[(x * bpp) + 2];
                rgba[o + 3] = bpp == 4 ? cur[(x * bpp) + 3] : (byte)255;
            }
            (prev, cur) = (cur, prev);
        }
        return new PngImage(width, height, rgba);
    }

    private static int Paeth(int a, int b, int c)
    {
        int p = a + b - c, pa = Math.Abs(p - a), pb = Math.Abs(p - b), pc = Math.Abs(p - c);
        return pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
    }

    /// <summary>The variance of the luminance (0..255 scale, Rec. 601 weights) over all pixels.</summary>
    public double LuminanceVariance()
    {
        double sum = 0, sum2 = 0;
        int n = Width * Height;
        for (int i = 0; i < n; i++)
        {
            double l = (0.299 * Rgba[4 * i]) + (0.587 * Rgba[(4 * i) + 1]) + (0.114 * Rgba[(4 * i) + 2]);
            sum += l; sum2 += l * l;
        }
        double mean = sum / n;
        return (sum2 / n) - (mean * mean);
    }

    /// <summary>How many pixels lie within <paramref name="tolerance"/> of a colour in each channel.</summary>
    public int CountNear(string hex, int tolerance)
    {
        int r = Convert.ToInt32(hex[1..3], 16), g = Convert.ToInt32(hex[3..5], 16), b = Convert.ToInt32(hex[5..7], 16);
        int count = 0;
        for (int i = 0; i < Width * Height; i++)
            if (Math.Abs(Rgba[4 * i] - r) <= tolerance && Math.Abs(Rgba[(4 * i) + 1] - g) <= tolerance &&
                Math.Abs(Rgba[(4 * i) + 2] - b) <= tolerance)
                count++;
        return count;
    }
}
