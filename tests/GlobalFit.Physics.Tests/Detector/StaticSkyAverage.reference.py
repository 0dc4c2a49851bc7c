# Independent check for SkyAveragedResponseTests (globalfit, Detector tests).
# Static, equal-arm, frequency-domain TDI response written from the formulas of
# Estabrook & Wahlquist 1975 (two-point link formula, monochromatic midpoint/sinc form), first-generation
# Michelson X, Y, Z, A/E/T of Prince et al. 2002 and the polarisation convention of PolarisationBasis.cs,
# sharing no code with globalfit.
# Units: c = 1, L = 1, so x = 2 pi f. Run: python3 StaticSkyAverage.reference.py (about a minute).
# Output used in the tests (24 x 48 sky grid, psi in {0, pi/4}):
#   x=0.1: R_X 0.1494977, R_A/R_X 1.50000000;  x=0.5: R_X 0.1378568, R_A/R_X 1.4999933
#   x=1:   R_X 0.1062353, R_A/R_X 1.4995077;   x=2:   R_X 0.0334756, R_A/R_X 1.4405365
#   x=3:   R_X 0.0081248, R_A/R_X 0.3671569
#   <|T|^2>/<|A|^2> / x^6 = 5.51e-4 (x=0.05), 5.52e-4 (0.1), 5.55e-4 (0.2), 5.66e-4 (0.4)
import cmath, math
L=1.0  # units with c=1, L=1 -> x = 2 pi f
s3=math.sqrt(3)
# static equilateral triangle in the xy plane (sky averages do not depend on its orientation)
P=[(0,0,0),(1,0,0),(0.5,s3/2,0)]
def sub(a,b): return tuple(a[i]-b[i] for i in range(3))
def dot(a,b): return sum(a[i]*b[i] for i in range(3))
def norm(a): l=math.sqrt(dot(a,a)); return tuple(c/l for c in a)
def gl(n):
    xs=[];ws=[]
    for i in range(n):
        z=math.cos(math.pi*(i+0.75)/(n+0.5))
        while True:
            p0,p1=1.0,0.0
            for k in range(1,n+1):
                p2=p1;p1=p0;p0=((2*k-1)*z*p1-(k-1)*p2)/k
            d=n*(z*p0-p1)/(z*z-1); st=p0/d; z-=st
            if abs(st)<1e-15: break
        xs.append(z); ws.append(2/((1-z*z)*d*d))
    return xs,ws
def powers(x,nm=24,nl=48):
    f=x/(2*math.pi)
    xs,ws=gl(nm)
    S={'X':0,'A':0,'E':0,'T':0};W=0
    for mu,w in zip(xs,ws):
        b=math.asin(mu)
        for l in range(nl):
            lam=2*math.pi*(l+0.5)/nl
            u=(math.sin(b)*math.cos(lam),math.sin(b)*math.sin(lam),-math.cos(b))
            v=(math.sin(lam),-math.cos(lam),0)
            k=(-math.cos(b)*math.cos(lam),-math.cos(b)*math.sin(lam),-math.sin(b))
            for psi in (0,math.pi/4):
                c2,s2=math.cos(2*psi),math.sin(2*psi)
                def y(i,j):
                    n=norm(sub(P[i],P[j]))
                    nu,nv=dot(n,u),dot(n,v)
                    Fp=c2*(nu*nu-nv*nv)+s2*2*nu*nv
                    kn=dot(k,n)
                    return Fp/(2*(1-kn))*(cmath.exp(-2j*math.pi*f*(1+dot(k,P[j])))-cmath.exp(-2j*math.pi*f*dot(k,P[i])))
                D=cmath.exp(-1j*x)
                def M(a,bb,c):
                    return (1-D*D)*(y(a,bb)+D*y(bb,a)-y(a,c)-D*y(c,a))
                X=M(0,1,2);Y=M(1,2,0);Z=M(2,0,1)
                A=(Z-X)/math.sqrt(2);E=(X-2*Y+Z)/math.sqrt(6);T=(X+Y+Z)/math.sqrt(3)
                for key,val in (('X',X),('A',A),('E',E),('T',T)): S[key]+=w*abs(val)**2
                W+=w
    return {k:v/W for k,v in S.items()}
for x in (0.1, 0.5, 1.0, 2.0, 3.0):
    p = powers(x)
    print(x, 'RX', p['X'] / (16 * x * x * math.sin(x) ** 2), 'RA/RX', p['A'] / p['X'], 'RE/RX', p['E'] / p['X'])
for x in (0.05, 0.1, 0.2, 0.4):
    p = powers(x, 12, 24)
    print(x, 'T/A', p['T'] / p['A'], '/x^6', (p['T'] / p['A']) / x ** 6)
