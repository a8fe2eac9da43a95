using System.Buffers.Binary;
using System.Globalization;
using System.Text;

namespace Lightfold.Catalog;

/// <summary>Minimal FITS primary-HDU images: 32-bit float data (BITPIX = −32) with header keywords.</summary>
/// <remarks>FITS Standard 4.0 (IAU FITS Working Group 2016): 2880-byte blocks of 36 80-character cards, fixed-format
/// values, big-endian IEEE floats, zero padding. Only what Lightfold writes is read back.</remarks>
public static class FitsImage
{
    const int Block = 2880, Card = 80;

    /// <summary>Writes a 2-D image atomically; <paramref name="keywords"/> values are double, long, bool or string.</summary>
    public static void Write(string path, float[] data, int width, int height, IReadOnlyList<(string Key, object Value, string Comment)> keywords)
    {
        var header = new StringBuilder();
        void Add(string key, string value, string comment)
        {
            string card = $"{key,-8}= {value,20}" + (comment.Length > 0 ? " / " + comment : "");
            header.Append((card.Length > Card ? card[..Card] : card).PadRight(Card));
        }
        Add("SIMPLE", "T", "conforms to FITS standard");
        Add("BITPIX", "-32", "IEEE single precision");
        Add("NAXIS", "2", "");
        Add("NAXIS1", width.ToString(CultureInfo.InvariantCulture), "");
        Add("NAXIS2", height.ToString(CultureInfo.InvariantCulture), "");
        foreach (var (key, value, comment) in keywords)
        {
            string k = key.ToUpperInvariant();
            if (k.Length > 8 || k.Any(c => !(char.IsAsciiLetterUpper(c) || char.IsAsciiDigit(c) || c == '_' || c == '-')))
                throw new ArgumentException($"invalid FITS keyword '{key}'");
            string text = value switch
            {
                bool b => b ? "T" : "F",
                double d => d.ToString("E14", CultureInfo.InvariantCulture),
                float f => ((double)f).ToString("E14", CultureInfo.InvariantCulture),
                int i => i.ToString(CultureInfo.InvariantCulture),
                long l => l.ToString(CultureInfo.InvariantCulture),
                ulong u => u.ToString(CultureInfo.InvariantCulture),
                string s => ("'" + s.Replace("'", "''") + "'").PadRight(20),
                _ => throw new ArgumentException($"unsupported FITS value for {key}"),
            };
            if (value is string) header.Append($"{k,-8}= {text}{(comment.Length > 0 ? " / " + comment : "")}".PadRight(Card)[..Card]);
            else Add(k, text, comment);
        }
        header.Append("END".PadRight(Card));
        while (header.Length % Block != 0) header.Append(' ');

        byte[] body = new byte[(data.Length * 4 + Block - 1) / Block * Block];
        for (int i = 0; i < data.Length; i++) BinaryPrimitives.WriteSingleBigEndian(body.AsSpan(4 * i), data[i]);
        string full = Path.GetFullPath(path);
        string temp = AtomicFile.TempName(full);
        try
        {
            using (var stream = File.Create(temp))
            {
                stream.Write(Encoding.ASCII.GetBytes(header.ToString()));
                stream.Write(body);
            }
            AtomicFile.Commit(temp, full);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            AtomicFile.TryDelete(temp);
            throw new InputException($"cannot write '{path}': {e.Message}");
        }
    }

    /// <summary>Reads an image written by <see cref="Write"/>: data, width, height and keyword values as text.</summary>
    public static (float[] Data, int Width, int Height, Dictionary<string, string> Keywords) Read(string path)
    {
        byte[] bytes = File.ReadAllBytes(path);
        var keywords = new Dictionary<string, string>(StringComparer.Ordinal);
        int offset = 0;
        bool end = false;
        while (!end)
        {
            if (offset + Block > bytes.Length) throw new InvalidDataException($"'{path}': FITS header has no END");
            for (int c = 0; c < 36 && !end; c++)
            {
                string card = Encoding.ASCII.GetString(bytes, offset + c * Card, Card);
                string key = card[..8].Trim();
                if (key == "END") end = true;
                else if (card.Length > 10 && card[8] == '=')
                {
                    string v = card[10..];
                    if (v.TrimStart().StartsWith('\''))
                    {
                        int q1 = v.IndexOf('\''), q2 = v.IndexOf('\'', q1 + 1);
                        keywords[key] = v[(q1 + 1)..q2].TrimEnd();
                    }
                    else keywords[key] = v.Split('/')[0].Trim();
                }
            }
            offset += Block;
        }
        if (keywords.GetValueOrDefault("BITPIX") != "-32") throw new InvalidDataException($"'{path}': only BITPIX = -32 is supported");
        int width = int.Parse(keywords["NAXIS1"], CultureInfo.InvariantCulture), height = int.Parse(keywords["NAXIS2"], CultureInfo.InvariantCulture);
        var data = new float[width * height];
        if (offset + 4L * data.Length > bytes.Length) throw new InvalidDataException($"'{path}': FITS data truncated");
        for (int i = 0; i < data.Length; i++) data[i] = BinaryPrimitives.ReadSingleBigEndian(bytes.AsSpan(offset + 4 * i));
        return (data, width, height, keywords);
    }
}
