using System.Buffers.Binary;
using System.Globalization;
using System.Text;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Microlensing;

public class MicromapCommandTests
{
    // An independent reader for the FITS files micromap writes (FITS Standard 4.0: 80-character cards in 2880-byte
    // blocks, big-endian IEEE floats for BITPIX = −32), written here without the library's reader.
    static (float[] Data, Dictionary<string, string> Keys) ReadFits(string path)
    {
        byte[] bytes = File.ReadAllBytes(path);
        var keys = new Dictionary<string, string>();
        int offset = 0;
        for (; ; offset += 80)
        {
            string card = Encoding.ASCII.GetString(bytes, offset, 80);
            if (card.StartsWith("END ")) break;
            if (card[8] == '=') keys[card[..8].Trim()] = card[10..].Split('/')[0].Trim().Trim('\'').Trim();
        }
        offset = (offset / 2880 + 1) * 2880;
        int nx = int.Parse(keys["NAXIS1"], CultureInfo.InvariantCulture), ny = int.Parse(keys["NAXIS2"], CultureInfo.InvariantCulture);
        var data = new float[nx * ny];
        for (int i = 0; i < data.Length; i++) data[i] = BinaryPrimitives.ReadSingleBigEndian(bytes.AsSpan(offset + 4 * i));
        return (data, keys);
    }

    // Independent check of micromap output: four 60 R_E maps read back from FITS average to the macro magnification
    // 1/|(1 − κ)² − γ²| within 1.5% (per-map scatter ≈ 1%, so four maps give ≈ 0.5% standard error), and the keywords
    // describe the map (R_E on the source plane for z_l = 0.5, z_s = 1: 4.11e16 cm, REFERENCES.md §7).
    [Fact]
    public void Micromap_maps_average_to_the_macro_magnification()
    {
        double sum = 0;
        for (int seed = 1; seed <= 4; seed++)
        {
            string fits = Path.Combine(Path.GetTempPath(), $"map-{Guid.NewGuid():N}.fits");
            var (code, output, err) = CliRunner.Run("micromap", "--kappa", "0.6", "--gamma", "0.3", "--kappa-star", "0.3", "--size", "60", "--pixels", "150",
                "--rays-per-pixel", "20", "--seed", seed.ToString(CultureInfo.InvariantCulture), "--z-lens", "0.5", "--z-source", "1.0", "--out", fits);
            Assert.True(code == 0, err);
            Assert.Contains("quantiles", output);
            var (data, keys) = ReadFits(fits);
            Assert.Equal("150", keys["NAXIS1"]);
            AssertRelative.Equal(0.6, double.Parse(keys["KAPPA"], CultureInfo.InvariantCulture), 1e-12);
            AssertRelative.Equal(4.11e16, double.Parse(keys["RE_CM"], CultureInfo.InvariantCulture), 0.0013);
            sum += data.Average(v => (double)v) / 4;
        }
        double macro = 1 / Math.Abs((1 - 0.6) * (1 - 0.6) - 0.3 * 0.3);
        AssertRelative.Equal(macro, sum, 0.015);
    }

    [Fact]
    public void Micromap_draws_a_png_and_refuses_bad_input()
    {
        string fits = Path.Combine(Path.GetTempPath(), $"map-{Guid.NewGuid():N}.fits"), png = Path.ChangeExtension(fits, ".png");
        var (code, _, err) = CliRunner.Run("micromap", "--kappa", "0.4", "--gamma", "0.3", "--kappa-star", "0.2", "--size", "10", "--pixels", "100",
            "--rays-per-pixel", "10", "--out", fits, "--png", png);
        Assert.True(code == 0, err);
        Assert.True(new FileInfo(png).Length > 10_000);
        Assert.Equal(2, CliRunner.Run("micromap", "--kappa", "0.4", "--gamma", "0.3", "--kappa-star", "0.5", "--out", fits).Code);
        Assert.Equal(2, CliRunner.Run("micromap", "--kappa", "0.5", "--gamma", "0.5", "--kappa-star", "0.2", "--out", fits).Code);
    }
}
