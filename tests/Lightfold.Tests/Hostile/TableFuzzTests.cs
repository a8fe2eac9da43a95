using System.Diagnostics;
using System.Globalization;
using System.Text;
using Lightfold.Catalog;
using Lightfold.Randomness;
using Xunit.Abstractions;

namespace Lightfold.Tests.Hostile;

/// <summary>Seeded-mutation fuzzing of user tables (visit tables, bandpasses, spectral templates): 10^4 cases each;
/// every case loads or ends in one InputException naming the file.</summary>
public class TableFuzzTests(ITestOutputHelper output)
{
    static readonly string[] Junk = ["", "x", "NaN", "-1", "0", "1e309", "-1e-9", "Infinity", "\"5\"", "1,2", "9e99", "  ", "#", "-0", "123456"];

    static string Mutate(string text, ref KeyedRandom rng)
    {
        if (text.Length < 2) return text + Junk[rng.NextInt(Junk.Length)];
        var lines = text.Split('\n').ToList();
        int line = rng.NextInt(lines.Count);
        switch (rng.NextInt(7))
        {
            case 0:
            case 1:
            {
                var cells = lines[line].Split(',');
                cells[rng.NextInt(cells.Length)] = Junk[rng.NextInt(Junk.Length)];
                lines[line] = string.Join(",", cells);
                break;
            }
            case 2: lines.RemoveAt(line); break;
            case 3: (lines[line], lines[rng.NextInt(lines.Count)]) = (lines[rng.NextInt(lines.Count)], lines[line]); break;
            case 4: return text[..rng.NextInt(text.Length + 1)];
            case 5: lines[0] = string.Join(",", lines[0].Split(',').Reverse().Skip(rng.NextInt(2))); break;
            default: lines.Insert(line, lines[rng.NextInt(lines.Count)]); break;
        }
        return string.Join('\n', lines);
    }

    void Fuzz(string name, string baseText, Action<string> load, ulong seed)
    {
        string dir = Path.Combine(Path.GetTempPath(), $"fuzz-tables-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        int ok = 0, refused = 0;
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < 10_000; i++)
        {
            var rng = KeyedRandom.For(seed, i, Stage.Population);
            bool parquet = rng.NextInt(100) == 0;
            string path = Path.Combine(dir, parquet ? "t.parquet" : "t.csv");
            if (parquet)
            {
                var bytes = new byte[rng.NextInt(400)];
                for (int b = 0; b < bytes.Length; b++) bytes[b] = (byte)rng.NextInt(256);
                if (bytes.Length > 8 && rng.NextInt(2) == 0) { "PAR1"u8.CopyTo(bytes); "PAR1"u8.CopyTo(bytes.AsSpan(bytes.Length - 4)); }
                File.WriteAllBytes(path, bytes);
            }
            else
            {
                string text = baseText;
                int n = 1 + rng.NextInt(3);
                for (int m = 0; m < n; m++) text = Mutate(text, ref rng);
                File.WriteAllText(path, text);
            }
            var start = watch.Elapsed;
            try
            {
                load(path);
                ok++;
            }
            catch (InputException e)
            {
                Assert.Contains(path, e.Message);
                refused++;
            }
            Assert.True((watch.Elapsed - start).TotalSeconds < 5, $"{name} case {i} took too long");
        }
        output.WriteLine($"{name} fuzz: 10000 cases, {ok} loaded, {refused} refused with one message naming the file, {watch.Elapsed.TotalSeconds:F1} s");
        Assert.True(refused > 1000, "refusals are exercised");
    }

    [Fact]
    public void Visit_tables()
    {
        var sb = new StringBuilder("mjd,band,depth_5sigma_mag,seeing_fwhm_arcsec\n");
        for (int i = 0; i < 30; i++) sb.Append(FormattableString.Invariant($"{60000 + i * 1.5},{(i % 2 == 0 ? "g" : "r")},{24 + 0.01 * i},{0.8 + 0.01 * i}\n"));
        Fuzz("visit-table", sb.ToString().TrimEnd(), p => ObservingResources.LoadVisitTable(p, ["g", "r"]), 201);
    }

    [Fact]
    public void Bandpass_tables()
    {
        var sb = new StringBuilder("wavelength_angstrom,transmission\n");
        for (int i = 0; i < 30; i++) sb.Append(FormattableString.Invariant($"{5000 + 20 * i},{Math.Sin(Math.PI * i / 29):F4}\n"));
        Fuzz("bandpass", sb.ToString().TrimEnd(), p => ObservingResources.LoadBandpass("q", p), 203);
    }

    [Fact]
    public void Spectral_templates()
    {
        var sb = new StringBuilder("phase_days,wavelength_angstrom,flux\n");
        for (int t = 1; t <= 5; t++)
            for (int l = 3000; l <= 9000; l += 1000) sb.Append(FormattableString.Invariant($"{t * 5},{l},{t * (l / 1000.0)}\n"));
        Fuzz("template", sb.ToString().TrimEnd(), p =>
        {
            var model = ObservingResources.LoadTemplate(p, 1e4);
            // A loaded template must also evaluate everywhere without throwing.
            for (double phase = 0; phase < 30; phase += 2.5) _ = model.SpectralLuminosity(phase, 5500) + model.PhotosphereRadiusCm(phase);
        }, 205);
    }
}
