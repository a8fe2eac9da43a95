using Lightfold.Numerics;

namespace Lightfold.Cosmology;

/// <summary>Distances, volumes and times of an FLRW universe, by direct quadrature.</summary>
/// <remarks>
/// Definitions follow Hogg 1999 (arXiv:astro-ph/9905116); the two-redshift transverse distance is
/// evaluated from the comoving distance between the redshifts with the curvature function, which is
/// exact for either sign of Ωk. Radiation (when Tcmb &gt; 0) follows the photon density of a
/// blackbody and the neutrino fitting formula of Komatsu et al. 2011 (ApJS 192, 18, eq. 26), as
/// astropy does, so the two agree. Immutable and thread-safe. For population work, where millions
/// of distances are needed, use <see cref="Table"/> (same values to &lt; 1e-7 relative).
/// </remarks>
public sealed class FlrwCosmology
{
    // 7/8 (4/11)^(4/3): energy density of one massless neutrino species per photon density.
    const double NeutrinoPerPhoton = 0.22710731766;
    // (4/11)^(1/3): neutrino to photon temperature ratio.
    const double NeutrinoTemperatureRatio = 0.7137658555036082;

    readonly double omegaPhoton0;
    readonly double[] neutrinoY;   // m_ν / (k_B T_ν0) of each massive species
    readonly int masslessSpecies;
    readonly double neffPerSpecies;
    readonly bool massiveNeutrinos;
    readonly Lazy<DistanceTable> table;

    /// <summary>Builds the cosmology from validated parameters.</summary>
    public FlrwCosmology(CosmologyParameters parameters)
    {
        Parameters = parameters;
        HubbleDistanceMpc = Units.SpeedOfLightKms / parameters.H0KmSMpc;
        HubbleTimeGyr = Units.KmPerMpc / parameters.H0KmSMpc / Units.SecondsPerGyr;

        if (parameters.TcmbK > 0)
        {
            // Ω_γ = (4σ/c³) T⁴ / ρ_crit, ρ_crit = 3 H0² / (8π G)   (SI units throughout)
            double h0PerS = parameters.H0KmSMpc / Units.KmPerMpc;
            double rhoCrit = 3.0 * h0PerS * h0PerS / (8.0 * Math.PI * Units.GravitationalConstantSi);
            double c = Units.SpeedOfLightKms * 1e3;
            omegaPhoton0 = 4.0 * Units.StefanBoltzmannSi / (c * c * c) * Math.Pow(parameters.TcmbK, 4) / rhoCrit;
            int species = (int)Math.Floor(parameters.Neff);
            neffPerSpecies = species > 0 ? parameters.Neff / species : 0.0;
            var masses = parameters.NeutrinoMassesEv;
            massiveNeutrinos = !masses.IsDefaultOrEmpty && masses.Any(m => m > 0);
            if (massiveNeutrinos)
            {
                if (masses.Length != species)
                    throw new ArgumentException($"neutrino masses: {masses.Length} given, but floor(Neff) = {species} species");
                double tNu0 = NeutrinoTemperatureRatio * parameters.TcmbK;
                neutrinoY = masses.Where(m => m > 0).Select(m => m / (Units.BoltzmannEvPerK * tNu0)).ToArray();
                masslessSpecies = masses.Count(m => m == 0);
            }
        }
        neutrinoY ??= [];
        OmegaRadiation0 = omegaPhoton0 * (1.0 + NeutrinoRelativeDensity(1.0));
        OmegaPhoton0 = omegaPhoton0;
        OmegaNeutrino0 = omegaPhoton0 * NeutrinoRelativeDensity(1.0);
        OmegaDarkEnergy0 = 1.0 - parameters.OmegaM0 - parameters.OmegaK0 - OmegaRadiation0;
        table = new Lazy<DistanceTable>(() => new DistanceTable(this), LazyThreadSafetyMode.ExecutionAndPublication);
    }

    /// <summary>The parameters this cosmology was built from.</summary>
    public CosmologyParameters Parameters { get; }

    /// <summary>Hubble distance c/H0 [Mpc].</summary>
    public double HubbleDistanceMpc { get; }

    /// <summary>Hubble time 1/H0 [Gyr].</summary>
    public double HubbleTimeGyr { get; }

    /// <summary>Dark-energy density today, Ω_DE = 1 − Ωm − Ωk − Ω_r.</summary>
    public double OmegaDarkEnergy0 { get; }

    /// <summary>Photon density today (0 without radiation).</summary>
    public double OmegaPhoton0 { get; }

    /// <summary>Neutrino density today (0 without radiation).</summary>
    public double OmegaNeutrino0 { get; }

    /// <summary>Photons plus neutrinos today.</summary>
    public double OmegaRadiation0 { get; }

    /// <summary>Curvature density today.</summary>
    public double OmegaK0 => Parameters.OmegaK0;

    /// <summary>Interpolation table for fast distances (built on first use, then shared).</summary>
    public DistanceTable Table => table.Value;

    // ρ_ν/ρ_γ at scale factor a (Komatsu et al. 2011 eq. 26 for massive species).
    double NeutrinoRelativeDensity(double a)
    {
        if (omegaPhoton0 == 0) return 0.0;
        if (!massiveNeutrinos) return NeutrinoPerPhoton * Parameters.Neff;
        const double p = 1.83, invP = 0.54644808743, k = 0.3173;
        double sum = masslessSpecies;
        foreach (double y in neutrinoY)
            sum += Math.Pow(1.0 + Math.Pow(k * y * a, p), invP);
        return NeutrinoPerPhoton * neffPerSpecies * sum;
    }

    /// <summary>(a E(a))², i.e. Ω_r/a² + Ωm/a + Ωk + Ω_DE a² f_DE(a), finite as a → 0.</summary>
    double AEsquared(double a)
    {
        var p = Parameters;
        double radiation = omegaPhoton0 == 0 ? 0.0 : omegaPhoton0 * (1.0 + NeutrinoRelativeDensity(a)) / (a * a);
        double de = OmegaDarkEnergy0 == 0 ? 0.0
            : OmegaDarkEnergy0 * a * a * (p.W0 == -1 && p.WA == 0 ? 1.0
                : Math.Pow(a, -3.0 * (1.0 + p.W0 + p.WA)) * Math.Exp(3.0 * p.WA * (a - 1.0)));
        return radiation + p.OmegaM0 / a + p.OmegaK0 + de;
    }

    /// <summary>Dimensionless Hubble rate E(z) = H(z)/H0.</summary>
    public double E(double z)
    {
        double a = 1.0 / (1.0 + z);
        return Math.Sqrt(AEsquared(a)) / a;
    }

    /// <summary>1/E(z), the integrand of the comoving distance.</summary>
    public double InverseE(double z)
    {
        double a = 1.0 / (1.0 + z);
        return a / Math.Sqrt(AEsquared(a));
    }

    /// <summary>Line-of-sight comoving distance from 0 to z [Mpc] (Hogg 1999 eq. 15).</summary>
    public double ComovingDistanceMpc(double z) => ComovingDistanceMpc(0.0, z);

    /// <summary>Line-of-sight comoving distance between z1 and z2 [Mpc]; negative if z2 &lt; z1.</summary>
    public double ComovingDistanceMpc(double z1, double z2)
        => HubbleDistanceMpc * Quadrature.Integrate(InverseE, z1, z2, relTol: 1e-13);

    /// <summary>Transverse comoving distance D_M(z) [Mpc] (Hogg 1999 eq. 16).</summary>
    public double TransverseComovingDistanceMpc(double z)
        => Curvature.TransverseFromLineOfSight(ComovingDistanceMpc(z), HubbleDistanceMpc, OmegaK0);

    /// <summary>Angular-diameter distance D_A(z) [Mpc] (Hogg 1999 eq. 18).</summary>
    public double AngularDiameterDistanceMpc(double z) => TransverseComovingDistanceMpc(z) / (1.0 + z);

    /// <summary>Angular-diameter distance from z1 to z2 (z2 ≥ z1) [Mpc], as used for lensing.</summary>
    /// <remarks>Hogg 1999 eq. 19, written through the comoving distance between the redshifts so it holds for Ωk &lt; 0 too.</remarks>
    public double AngularDiameterDistanceMpc(double z1, double z2)
    {
        if (z2 < z1) throw new ArgumentOutOfRangeException(nameof(z2), z2, $"must be ≥ z1 = {z1}");
        return Curvature.TransverseFromLineOfSight(ComovingDistanceMpc(z1, z2), HubbleDistanceMpc, OmegaK0) / (1.0 + z2);
    }

    /// <summary>Luminosity distance D_L = (1 + z) D_M [Mpc] (Hogg 1999 eq. 21).</summary>
    public double LuminosityDistanceMpc(double z) => (1.0 + z) * TransverseComovingDistanceMpc(z);

    /// <summary>Distance modulus 5 log10(D_L / 10 pc) [mag] (Hogg 1999 eq. 25).</summary>
    public double DistanceModulusMag(double z) => Curvature.DistanceModulus(LuminosityDistanceMpc(z));

    /// <summary>Comoving volume element dV_C/dz/dΩ [Mpc³ sr⁻¹] (Hogg 1999 eq. 28).</summary>
    public double DifferentialComovingVolumeMpc3(double z)
    {
        double dm = TransverseComovingDistanceMpc(z);
        return HubbleDistanceMpc * dm * dm * InverseE(z);
    }

    /// <summary>All-sky comoving volume out to z [Mpc³] (Hogg 1999 eq. 29).</summary>
    public double ComovingVolumeMpc3(double z)
        => Curvature.ComovingVolume(TransverseComovingDistanceMpc(z), HubbleDistanceMpc, OmegaK0);

    /// <summary>Lookback time to z [Gyr] (Hogg 1999 eq. 30).</summary>
    public double LookbackTimeGyr(double z)
    {
        if (z == 0) return 0.0;
        double a = 1.0 / (1.0 + z);
        // t_L = t_H ∫_a^1 da' / (a' E(a'))
        return HubbleTimeGyr * Quadrature.Integrate(x => 1.0 / Math.Sqrt(AEsquared(x)), a, 1.0, relTol: 1e-13);
    }

    /// <summary>Age of the universe at z [Gyr]: t_H ∫_z^∞ dz' / ((1 + z') E(z')).</summary>
    public double AgeGyr(double z)
    {
        // Substituting a = s² removes the a^(1/2) behaviour at the Big Bang: dt = t_H 2 s ds / (a E).
        double sMax = Math.Sqrt(1.0 / (1.0 + z));
        return HubbleTimeGyr * Quadrature.Integrate(s => 2.0 * s / Math.Sqrt(AEsquared(s * s)), 0.0, sMax, relTol: 1e-13);
    }

    /// <summary>Time-delay distance D_Δt = (1 + z_d) D_d D_s / D_ds [Mpc] for a deflector at z_d and a source at z_s.</summary>
    /// <remarks>Refsdal 1964 (MNRAS 128, 307); notation of Suyu et al. 2010 (ApJ 711, 201) (from memory).</remarks>
    public double TimeDelayDistanceMpc(double zDeflector, double zSource)
    {
        if (zSource <= zDeflector) throw new ArgumentOutOfRangeException(nameof(zSource), zSource, $"must exceed the deflector redshift {zDeflector}");
        return (1.0 + zDeflector) * AngularDiameterDistanceMpc(zDeflector) * AngularDiameterDistanceMpc(zSource)
               / AngularDiameterDistanceMpc(zDeflector, zSource);
    }
}
