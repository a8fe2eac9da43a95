using System.Globalization;
using Lightfold.Cosmology;

namespace Lightfold.Tests.Cosmology;

/// <summary>One row of Data/cosmology_astropy.csv (made by scripts/reference/make_cosmology_reference.py, astropy 5.2.1).</summary>
public sealed record AstropyRow(string Case, CosmologyParameters Parameters, double Z, double Z1, IReadOnlyDictionary<string, double> Values)
{
    /// <summary>Reads every row of the committed reference table.</summary>
    public static IReadOnlyList<AstropyRow> Load()
    {
        string path = Path.Combine(AppContext.BaseDirectory, "Data", "cosmology_astropy.csv");
        var lines = File.ReadAllLines(path).Where(l => !l.StartsWith('#')).ToList();
        string[] header = lines[0].Split(',');
        var rows = new List<AstropyRow>();
        foreach (string line in lines.Skip(1))
        {
            string[] f = line.Split(',');
            double D(string name) => double.Parse(f[Array.IndexOf(header, name)], CultureInfo.InvariantCulture);
            string masses = f[Array.IndexOf(header, "m_nu_ev")];
            var p = new CosmologyParameters
            {
                H0KmSMpc = D("h0"), OmegaM0 = D("om0"), OmegaK0 = D("ok0"), W0 = D("w0"), WA = D("wa"),
                TcmbK = D("tcmb0"), Neff = D("neff"),
                NeutrinoMassesEv = masses.Length == 0 ? [] : [.. masses.Split(';').Select(s => double.Parse(s, CultureInfo.InvariantCulture))],
            };
            var values = new Dictionary<string, double>();
            foreach (string name in header.Skip(11)) values[name] = D(name);
            rows.Add(new AstropyRow(f[0], p, D("z"), D("z1"), values));
        }
        return rows;
    }
}
