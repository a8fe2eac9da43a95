using System.Collections.Immutable;
using Lightfold.Cosmology;

namespace Lightfold.Configuration;

/// <summary>Maps configuration keys onto the scenario's records; the only place key names are spelled.</summary>
public static class ScenarioBinder
{
    /// <summary>Reads every section of the scenario.</summary>
    public static Scenario Bind(ConfigReader r)
    {
        var run = r.Section("run");
        string name = run.Text("name", 120);
        ulong seed = run.UInt64("seed");
        return new Scenario
        {
            Name = name,
            Seed = seed,
            Cosmology = BindCosmology(r.Section("cosmology")),
        };
    }

    static CosmologyParameters BindCosmology(ConfigReader c)
    {
        var p = new CosmologyParameters
        {
            H0KmSMpc = c.Double("h0_kms_mpc", 1.0, 1000.0, "km/s/Mpc"),
            OmegaM0 = c.Double("omega_m0", 0.0, 10.0),
            OmegaK0 = c.Double("omega_k0", -2.0, 2.0),
            W0 = c.Double("w0", -5.0, 1.0),
            WA = c.Double("wa", -5.0, 5.0),
            TcmbK = c.Double("tcmb0_k", 0.0, 100.0, "K (0 = no radiation)"),
            Neff = c.Double("neff", 0.0, 20.0),
            NeutrinoMassesEv = [.. c.DoubleList("neutrino_masses_ev", 0.0, 10.0, 0, 20)],
        };
        int species = (int)Math.Floor(p.Neff);
        if (p.NeutrinoMassesEv.Length != 0 && p.NeutrinoMassesEv.Length != species)
            throw new InputException($"config key 'cosmology.neutrino_masses_ev' has {p.NeutrinoMassesEv.Length} values: expected none (massless) or floor(neff) = {species}");
        // A universe that recollapses before today, or has no big bang, cannot be integrated.
        var cosmology = new FlrwCosmology(p);
        for (double a = 1.0; a > 1e-4; a *= 0.9)
        {
            double e2 = cosmology.E(1.0 / a - 1.0);
            if (!(e2 > 0) || double.IsNaN(e2))
                throw new InputException($"cosmology (omega_m0 = {p.OmegaM0}, omega_k0 = {p.OmegaK0}, w0 = {p.W0}, wa = {p.WA}) has H(z)² ≤ 0 at z = {1.0 / a - 1.0:F3}: not a valid expanding universe");
        }
        return p;
    }
}
