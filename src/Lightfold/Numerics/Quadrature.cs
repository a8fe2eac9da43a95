namespace Lightfold.Numerics;

/// <summary>Deterministic adaptive quadrature on a finite interval.</summary>
/// <remarks>
/// Gauss–Kronrod 7/15-point pair with recursive bisection (Kronrod 1965; nodes and weights as
/// tabulated in Piessens et al. 1983, QUADPACK). Use <see cref="GaussLegendre8"/> on short,
/// smooth pieces where a fixed rule is accurate enough and speed matters.
/// </remarks>
public static class Quadrature
{
    static readonly double[] KronrodNodes =
    [
        0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
        0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
        0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
        0.207784955007898467600689403773245, 0.000000000000000000000000000000000,
    ];

    static readonly double[] KronrodWeights =
    [
        0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
        0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
        0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
        0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
    ];

    // Gauss 7-point weights for the odd-indexed Kronrod nodes (1, 3, 5, 7).
    static readonly double[] GaussWeights =
    [
        0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
        0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
    ];

    /// <summary>∫_a^b f(x) dx to a relative tolerance (absolute where the integral is near zero).</summary>
    /// <param name="f">Smooth integrand.</param>
    /// <param name="a">Lower limit.</param>
    /// <param name="b">Upper limit (may be below <paramref name="a"/>).</param>
    /// <param name="relTol">Target relative error, e.g. 1e-12.</param>
    /// <param name="absTol">Target absolute error floor.</param>
    public static double Integrate(Func<double, double> f, double a, double b, double relTol = 1e-12, double absTol = 1e-300)
    {
        if (a == b) return 0.0;
        double whole = Kronrod(f, a, b, out double err);
        return Refine(f, a, b, whole, err, relTol, absTol, depth: 0);
    }

    static double Refine(Func<double, double> f, double a, double b, double whole, double err, double relTol, double absTol, int depth)
    {
        if (err <= Math.Max(absTol, relTol * Math.Abs(whole)) || depth >= 50)
            return whole;
        double m = 0.5 * (a + b);
        double left = Kronrod(f, a, m, out double errL);
        double right = Kronrod(f, m, b, out double errR);
        double sum = left + right;
        // Each half gets half of the absolute budget implied by the current estimate.
        double tolAbs = Math.Max(absTol, relTol * Math.Abs(sum)) * 0.5;
        return Refine(f, a, m, left, errL, 0.0, tolAbs, depth + 1)
             + Refine(f, m, b, right, errR, 0.0, tolAbs, depth + 1);
    }

    static double Kronrod(Func<double, double> f, double a, double b, out double error)
    {
        double centre = 0.5 * (a + b), half = 0.5 * (b - a);
        double fc = f(centre);
        double kronrod = fc * KronrodWeights[7];
        double gauss = fc * GaussWeights[3];
        for (int j = 0; j < 7; j++)
        {
            double dx = half * KronrodNodes[j];
            double fsum = f(centre - dx) + f(centre + dx);
            kronrod += KronrodWeights[j] * fsum;
            if (j % 2 == 1) gauss += GaussWeights[j / 2] * fsum;
        }
        // |K15 − G7| bounds the 7-point error, so it is a safe (pessimistic) estimate for K15.
        error = Math.Abs((kronrod - gauss) * half);
        return kronrod * half;
    }

    static readonly double[] Gl8Nodes =
    [
        0.183434642495649804939476142360184, 0.525532409916328985817739049189246,
        0.796666477413626739591553936475830, 0.960289856497536231683560868569473,
    ];

    static readonly double[] Gl8Weights =
    [
        0.362683783378361982965150449277196, 0.313706645877887287337962201986601,
        0.222381034453374470544355994426241, 0.101228536290376259152531354309861,
    ];

    /// <summary>Fixed 8-point Gauss–Legendre rule on [a, b]; exact for polynomials of degree ≤ 15.</summary>
    public static double GaussLegendre8<TFunc>(TFunc f, double a, double b) where TFunc : IScalarFunction
    {
        double centre = 0.5 * (a + b), half = 0.5 * (b - a);
        double sum = 0.0;
        for (int j = 0; j < 4; j++)
        {
            double dx = half * Gl8Nodes[j];
            sum += Gl8Weights[j] * (f.Evaluate(centre - dx) + f.Evaluate(centre + dx));
        }
        return sum * half;
    }
}

/// <summary>A real function of one variable, as a struct so hot quadrature loops inline it.</summary>
public interface IScalarFunction
{
    /// <summary>Value at <paramref name="x"/>.</summary>
    double Evaluate(double x);
}
