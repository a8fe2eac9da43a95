using System.Runtime.CompilerServices;
using Lightfold.Numerics;

namespace Lightfold.Cosmology;

/// <summary>Fast distances for population work: the comoving distance tabulated on a uniform redshift grid.</summary>
/// <remarks>
/// Cubic Hermite interpolation between nodes, using the exact derivative dD_C/dz = D_H/E(z) at each
/// node, so the error is O(h⁴ D_C'''') (h = 1/128): below 1e-9 relative over 0 ≤ z ≤ 10 for the
/// cosmologies tested (the tests hold it to 1e-7). Node values come from an 8-point Gauss–Legendre
/// rule per interval. Beyond <see cref="MaxRedshift"/> it falls back to the exact quadrature.
/// Immutable and thread-safe; obtain it from <see cref="FlrwCosmology.Table"/>.
/// </remarks>
public sealed class DistanceTable
{
    /// <summary>Grid spacing in redshift.</summary>
    public const double Step = 1.0 / 128.0;

    /// <summary>Largest tabulated redshift.</summary>
    public const double MaxRedshift = 16.0;

    const int Intervals = (int)(MaxRedshift / Step);

    readonly double[] comoving;   // D_C at nodes [Mpc]
    readonly double[] slope;      // dD_C/dz at nodes, times Step [Mpc]
    readonly FlrwCosmology cosmology;
    readonly double hubbleDistanceMpc;
    readonly double omegaK;

    internal DistanceTable(FlrwCosmology cosmology)
    {
        this.cosmology = cosmology;
        hubbleDistanceMpc = cosmology.HubbleDistanceMpc;
        omegaK = cosmology.OmegaK0;
        comoving = new double[Intervals + 1];
        slope = new double[Intervals + 1];
        var integrand = new InverseHubble(cosmology);
        for (int i = 0; i <= Intervals; i++)
        {
            double z = i * Step;
            slope[i] = hubbleDistanceMpc * cosmology.InverseE(z) * Step;
            if (i > 0)
                comoving[i] = comoving[i - 1] + hubbleDistanceMpc * Quadrature.GaussLegendre8(integrand, z - Step, z);
        }
    }

    readonly struct InverseHubble(FlrwCosmology c) : IScalarFunction
    {
        public double Evaluate(double x) => c.InverseE(x);
    }

    /// <summary>The cosmology this table interpolates.</summary>
    public FlrwCosmology Cosmology => cosmology;

    /// <summary>Line-of-sight comoving distance D_C(z) [Mpc].</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double ComovingDistanceMpc(double z)
    {
        double u = z * (1.0 / Step);
        if (!(u >= 0.0 && u < Intervals)) return OutOfRange(z);
        int i = (int)u;
        double t = u - i;
        double t2 = t * t, t3 = t2 * t;
        // Cubic Hermite basis on [0, 1].
        double h00 = 2 * t3 - 3 * t2 + 1, h10 = t3 - 2 * t2 + t, h01 = -2 * t3 + 3 * t2, h11 = t3 - t2;
        return h00 * comoving[i] + h10 * slope[i] + h01 * comoving[i + 1] + h11 * slope[i + 1];
    }

    double OutOfRange(double z)
    {
        if (z == MaxRedshift) return comoving[Intervals];
        if (z < 0 || double.IsNaN(z)) throw new ArgumentOutOfRangeException(nameof(z), z, "redshift must be ≥ 0");
        return cosmology.ComovingDistanceMpc(z);
    }

    /// <summary>Transverse comoving distance D_M(z) [Mpc].</summary>
    public double TransverseComovingDistanceMpc(double z)
        => Curvature.TransverseFromLineOfSight(ComovingDistanceMpc(z), hubbleDistanceMpc, omegaK);

    /// <summary>Angular-diameter distance D_A(z) [Mpc].</summary>
    public double AngularDiameterDistanceMpc(double z) => TransverseComovingDistanceMpc(z) / (1.0 + z);

    /// <summary>Angular-diameter distance between z1 and z2 ≥ z1 [Mpc].</summary>
    public double AngularDiameterDistanceMpc(double z1, double z2)
        => Curvature.TransverseFromLineOfSight(ComovingDistanceMpc(z2) - ComovingDistanceMpc(z1), hubbleDistanceMpc, omegaK) / (1.0 + z2);

    /// <summary>Luminosity distance [Mpc].</summary>
    public double LuminosityDistanceMpc(double z) => (1.0 + z) * TransverseComovingDistanceMpc(z);

    /// <summary>Distance modulus [mag].</summary>
    public double DistanceModulusMag(double z) => Curvature.DistanceModulus(LuminosityDistanceMpc(z));

    /// <summary>Comoving volume element dV_C/dz/dΩ [Mpc³ sr⁻¹].</summary>
    public double DifferentialComovingVolumeMpc3(double z)
    {
        double dm = TransverseComovingDistanceMpc(z);
        return hubbleDistanceMpc * dm * dm * cosmology.InverseE(z);
    }

    /// <summary>Time-delay distance (1 + z_d) D_d D_s / D_ds [Mpc].</summary>
    public double TimeDelayDistanceMpc(double zDeflector, double zSource)
        => (1.0 + zDeflector) * AngularDiameterDistanceMpc(zDeflector) * AngularDiameterDistanceMpc(zSource)
           / AngularDiameterDistanceMpc(zDeflector, zSource);
}
